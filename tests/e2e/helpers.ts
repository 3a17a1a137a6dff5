import { expect, type Page } from "@playwright/test";

/** Signs in through the password form and waits for the studio. */
export async function signInWithPassword(
  page: Page,
  email: string,
  password: string,
  callbackUrl?: string,
) {
  await page.goto(
    callbackUrl ? `/sign-in?callbackUrl=${encodeURIComponent(callbackUrl)}` : "/sign-in",
  );
  await page.locator("#pw-email").fill(email);
  await page.locator("#pw-password").fill(password);
  await page.getByRole("button", { name: "Sign in", exact: true }).click();
  await expect(page.getByTestId("signed-in-as")).toHaveText(email);
}
