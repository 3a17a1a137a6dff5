import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { demoAccount } from "../helpers/demo";
import { signInWithPassword } from "./helpers";

const slug = "low-tide-almanac";

/**
 * Runs axe over the page as it stands and fails on any serious or critical violation, naming
 * each rule with the first few offending elements. WCAG 2.x A and AA rules, as the goal asks
 * (WCAG 2.2: 4.5:1 for body text, 3:1 for large text and UI parts).
 */
async function expectNoSeriousViolations(page: Page, screen: string) {
  const result = await new AxeBuilder({ page })
    .withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa", "wcag22aa", "best-practice"])
    .analyze();
  const serious = result.violations.filter(
    (v) => v.impact === "serious" || v.impact === "critical",
  );
  const report = serious.map(
    (v) =>
      `${v.id} (${v.impact}, ${v.nodes.length} element${v.nodes.length === 1 ? "" : "s"}): ${v.help}\n` +
      v.nodes
        .slice(0, 3)
        .map(
          (n) => `    ${n.target.join(" ")}: ${n.failureSummary?.split("\n").slice(1, 2).join("")}`,
        )
        .join("\n"),
  );
  expect(serious.length, `${screen}:\n  ${report.join("\n  ")}`).toBe(0);
}

test("public screens pass axe", async ({ page }) => {
  await page.goto("/");
  await expect(page.getByTestId("demo-accounts")).toBeVisible();
  await expectNoSeriousViolations(page, "the landing page");

  await page.goto("/sign-in");
  await expect(page.locator("#pw-email")).toBeVisible();
  await expectNoSeriousViolations(page, "sign-in");

  await page.goto(`/calls/${slug}`);
  await expect(page.locator("h1")).toBeVisible();
  await expectNoSeriousViolations(page, "the public call");
});

test("a contributor's screens pass axe", async ({ page }) => {
  const bea = demoAccount("bea");
  await signInWithPassword(page, bea.email, bea.password);
  await expectNoSeriousViolations(page, "the studio home");

  await page.goto(`/calls/${slug}/submit`);
  await expect(page.locator("h1")).toBeVisible();
  await expectNoSeriousViolations(page, "the submit page");

  await page.goto(`/studio/${slug}/my-pieces`);
  const firstPiece = page.getByTestId("my-piece-link").first();
  await expect(firstPiece).toBeVisible();
  await expectNoSeriousViolations(page, "my pieces");
  await firstPiece.click();
  await expect(page.getByTestId("my-piece-page")).toBeVisible();
  await expectNoSeriousViolations(page, "the piece page");
});

test("the lead's screens pass axe", async ({ page }) => {
  test.slow(); // twelve screens in one walk
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await expectNoSeriousViolations(page, "the studio home");

  await page.goto(`/studio/${slug}`);
  await expect(page.locator("h1")).toBeVisible();
  await expectNoSeriousViolations(page, "the overview");

  await page.goto(`/studio/${slug}/call`);
  await expect(page.locator("h1")).toBeVisible();
  await expectNoSeriousViolations(page, "the call editor");

  await page.goto(`/studio/${slug}/spec`);
  await expect(page.locator("h1")).toBeVisible();
  await expectNoSeriousViolations(page, "the print spec");

  await page.goto(`/studio/${slug}/members`);
  await expect(page.locator("h1")).toBeVisible();
  await expectNoSeriousViolations(page, "members");

  await page.goto(`/studio/${slug}/submissions`);
  const rows = page.getByTestId("submission-row");
  await expect(rows.first()).toBeVisible();
  await expectNoSeriousViolations(page, "the submissions table");

  await rows.getByTestId("piece-link").first().click();
  await expect(page.getByTestId("piece-title")).toBeVisible();
  await expectNoSeriousViolations(page, "the piece detail");

  await page.goto(`/studio/${slug}/map`);
  await expect(page.getByTestId("map-screen")).toBeVisible();
  await expect(page.getByTestId("view-reader")).toHaveAttribute("aria-pressed", "true");
  await expectNoSeriousViolations(page, "the map, as read");
  await page.getByTestId("view-sheets").click();
  await expect(page.getByTestId("view-sheets")).toHaveAttribute("aria-pressed", "true");
  await expectNoSeriousViolations(page, "the map, as printed");

  await page.goto(`/studio/${slug}/run`);
  await expect(page.getByTestId("run-summary")).toBeVisible();
  await expectNoSeriousViolations(page, "the print run planner");

  await page.goto(`/studio/${slug}/finishing`);
  await expect(page.getByTestId("batch").first()).toBeVisible();
  await expectNoSeriousViolations(page, "the finishing batches");

  await page.goto(`/studio/${slug}/stock`);
  await expect(page.getByTestId("stock-counts")).toBeVisible();
  await expectNoSeriousViolations(page, "the stock");
});

test("the sales and payouts screens pass axe", async ({ page }) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await page.goto(`/studio/${slug}/sales`);
  await expect(page.getByTestId("sales")).toBeVisible();
  await expectNoSeriousViolations(page, "sales");
  await page.goto(`/studio/${slug}/payouts`);
  await expect(page.getByTestId("person-ledger").first()).toBeVisible();
  await page.locator("details summary").first().click();
  await expectNoSeriousViolations(page, "payouts");

  await page.context().clearCookies();
  const tomasz = demoAccount("tomasz");
  await signInWithPassword(page, tomasz.email, tomasz.password);
  await page.goto(`/studio/${slug}/my-payouts`);
  await expect(page.getByTestId("my-totals")).toBeVisible();
  await expectNoSeriousViolations(page, "my payouts");
});
