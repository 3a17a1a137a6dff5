import { expect, test } from "@playwright/test";
import { demoAccount } from "../helpers/demo";
import { signInWithPassword } from "./helpers";

const slug = "low-tide-almanac";

test("a contributor connects a payout account through the payments fake's set-up page", async ({
  page,
}) => {
  const imke = demoAccount("imke");
  await signInWithPassword(page, imke.email, imke.password);
  await page.goto(`/studio/${slug}/my-payouts`);
  await expect(page.getByTestId("account-state")).toContainText("No payout account yet");
  await page.getByRole("button", { name: "Connect a payout account" }).click();
  await expect(page.getByRole("heading", { name: /Set up payouts/ })).toBeVisible();
  await page.getByLabel("Name on the account").fill("Imke Sallow");
  await page.getByRole("button", { name: "Finish and go back" }).click();
  await expect(page).toHaveURL(new RegExp(`/studio/${slug}/my-payouts\\?account=returned$`));
  await expect(page.getByTestId("account-state")).toContainText("Connected");
});

test("the lead sees each contributor's working and downloads the ledger", async ({ page }) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await page.goto(`/studio/${slug}/payouts`);
  const tomasz = page.getByTestId("person-ledger").filter({ hasText: "Tomasz Vireo" });
  await expect(tomasz).toContainText("still to pay $0.00");
  await tomasz.locator("summary").first().click();
  await expect(tomasz).toContainText("Flat fee of");
  const download = page.waitForEvent("download");
  await page.getByRole("link", { name: "Ledger (CSV)" }).click();
  expect((await download).suggestedFilename()).toBe(`${slug}-ledger.csv`);
});

test("a finisher is kept out of sales and payouts", async ({ page }) => {
  const cass = demoAccount("cass");
  await signInWithPassword(page, cass.email, cass.password);
  for (const screen of ["sales", "payouts", "my-payouts"]) {
    const res = await page.goto(`/studio/${slug}/${screen}`);
    expect(res?.status()).toBe(403);
  }
  await page.goto(`/studio/${slug}`);
  await expect(page.getByRole("link", { name: "Payouts" })).toHaveCount(0);
});
