import { expect, test } from "@playwright/test";
import { demoAccount } from "../helpers/demo";
import { signInWithPassword } from "./helpers";

const slug = "low-tide-almanac";

test("the lead weighs quantities: a changed price moves the sentence, the chart and the table together; a bad price changes nothing", async ({
  page,
}) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password, `/studio/${slug}/run`);
  const summary = page.getByTestId("run-summary");
  await expect(summary).toBeVisible();
  await expect(page.getByTestId("cost-chart").locator(".recharts-line")).toHaveCount(3);
  await expect(page.getByTestId("cost-table").locator("tbody tr")).toHaveCount(5);
  await expect(page.getByRole("figure", { name: /Cost per copy by quantity/ })).toBeVisible();

  // Keyboard: quantities typed into the field rebuild the table.
  await page.locator("#quantities").focus();
  await page.keyboard.press("ControlOrMeta+a");
  await page.keyboard.type("10, 20, 40");
  await expect(page.getByTestId("cost-table").locator("tbody tr")).toHaveCount(3);

  const copyShopCell = page.locator('tr[data-copies="10"] td[data-option="copy-shop"]');
  const before = await copyShopCell.textContent();
  const beforeSummary = await summary.textContent();
  const chartBefore = await page
    .getByTestId("cost-chart")
    .locator('svg[role="application"]')
    .innerHTML();
  await page.locator("#price-copyShopSide").fill("0.01");
  await expect(copyShopCell).not.toHaveText(before ?? "");
  await expect
    .poll(() => page.getByTestId("cost-chart").locator('svg[role="application"]').innerHTML())
    .not.toBe(chartBefore);
  await expect(summary).not.toHaveText(beforeSummary ?? "");

  // A negative price: a field message, the figures stay as they were.
  const shown = await summary.textContent();
  const cell = await copyShopCell.textContent();
  await page.locator("#price-insidePaper").fill("-1");
  await expect(page.getByTestId("error-price-insidePaper")).toHaveText(
    "Text paper cannot be negative",
  );
  await expect(page.getByTestId("run-stale")).toBeVisible();
  await expect(summary).toHaveText(shown ?? "");
  await expect(copyShopCell).toHaveText(cell ?? "");

  // The demo's three events each have a batch.
  await expect(page.getByTestId("batch-schedule").locator("li")).toHaveCount(3);
});

test("an event in the past is refused beside its field", async ({ page }) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password, `/studio/${slug}/run`);
  await page.locator("#event-name").fill("Last year's fair");
  await page.locator("#event-date").fill("2020-05-01");
  await page.locator("#event-copies").fill("10");
  await page.getByRole("button", { name: "Add the event" }).click();
  await expect(page.getByTestId("error-event-date")).toContainText("in the past");
  await expect(page.getByTestId("batch-schedule").locator("li")).toHaveCount(3);
});

test("the demo finisher ticks a step by keyboard, sees no private data, and may not open the planner", async ({
  page,
}) => {
  const finisher = demoAccount("cass");
  await signInWithPassword(page, finisher.email, finisher.password, `/studio/${slug}/finishing`);
  await expect(page.getByTestId("finishing-safety")).toContainText("workshop's own rules");
  const firstBatch = page.getByTestId("batch").first();
  const fold = firstBatch.getByRole("checkbox", { name: /^Fold/ });
  await expect(fold).not.toBeChecked();
  await fold.focus();
  await page.keyboard.press("Space");
  await expect(fold).toBeChecked();
  await expect(firstBatch).toContainText("done by Cass Rennick");
  await expect(page.getByTestId("finishing-progress")).toContainText("3 of");
  // Put it back for the other tests.
  await fold.focus();
  await page.keyboard.press("Space");
  await expect(fold).not.toBeChecked();

  await page.goto(`/studio/${slug}/stock`);
  await expect(page.getByTestId("stock-counts")).toBeVisible();
  const text = (await page.locator("main").textContent()) ?? "";
  expect(text).not.toMatch(/@lanternfield\.test/);

  const response = await page.goto(`/studio/${slug}/run`);
  expect(response?.status()).toBe(403);
});
