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

/**
 * The body of a new-anthology request for a 16-page half-letter booklet printed on a stencil
 * duplicator, with 1/8 in bleed and 1/4 in safe margin; tests spread it and change what they need.
 */
export function halfLetterAnthology(title: string, inks: string[] = ["black", "teal"]) {
  return {
    title,
    pressName: "Marrowbend Print Collective",
    trimChoice: "half-letter",
    orientation: "portrait",
    unit: "in",
    bleed: 0.125,
    safeMargin: 0.25,
    binding: "saddle-stitch",
    pageCountTarget: 16,
    maxPages: 32,
    coverStock: "self",
    paperGsm: 90,
    printMethod: "duplicator",
    inks,
    inksPerPass: 1,
    minPpi: 300,
  };
}
