import { expect, test, type Page } from "@playwright/test";
import { demoAccount } from "../helpers/demo";
import { signInWithPassword } from "./helpers";

// A common phone width in portrait (390 x 844 CSS px); common practice, no source.
test.use({ viewport: { width: 390, height: 844 } });

const slug = "low-tide-almanac";

/**
 * Fails when the page scrolls sideways, naming the widest elements that stick out past the
 * viewport (ignoring those inside a box that scrolls or clips on its own).
 */
async function expectNoSidewaysScroll(page: Page, screen: string) {
  const report = await page.evaluate(() => {
    const viewport = window.innerWidth;
    const scrollWidth = document.documentElement.scrollWidth;
    if (scrollWidth <= viewport + 1) return null;
    const clipped = (el: Element) => {
      for (let p = el.parentElement; p && p !== document.body; p = p.parentElement) {
        const x = getComputedStyle(p).overflowX;
        if (x !== "visible") return true;
      }
      return false;
    };
    const describe = (el: Element) => {
      const id = el.id ? `#${el.id}` : "";
      const testId = el.getAttribute("data-testid");
      const cls =
        typeof el.className === "string" ? el.className.trim().split(/\s+/).slice(0, 3) : [];
      const text = (el.textContent ?? "").trim().slice(0, 30);
      return `<${el.tagName.toLowerCase()}${id}${testId ? ` data-testid=${testId}` : ""}${cls.length ? ` .${cls.join(".")}` : ""}> "${text}"`;
    };
    const offenders = [...document.body.querySelectorAll("*")]
      .map((el) => ({ el, rect: el.getBoundingClientRect() }))
      .filter(({ el, rect }) => rect.width > 0 && rect.right > viewport + 1 && !clipped(el))
      .sort((a, b) => b.rect.width - a.rect.width)
      .slice(0, 5)
      .map(
        ({ el, rect }) =>
          `${describe(el)} ${Math.round(rect.width)} px wide, right edge at ${Math.round(rect.right)} px`,
      );
    return { scrollWidth, viewport, offenders };
  });
  expect(
    report,
    report
      ? `${screen} is ${report.scrollWidth} px wide in a ${report.viewport} px viewport; widest offenders:\n  ${report.offenders.join("\n  ")}`
      : "",
  ).toBeNull();
}

test("public screens fit a phone", async ({ page }) => {
  await page.goto("/");
  await expect(page.getByTestId("demo-accounts")).toBeVisible();
  await expectNoSidewaysScroll(page, "the landing page");

  await page.goto("/sign-in");
  await expect(page.locator("#pw-email")).toBeVisible();
  await expectNoSidewaysScroll(page, "sign-in");

  await page.goto(`/calls/${slug}`);
  await expect(page.locator("h1")).toBeVisible();
  await expectNoSidewaysScroll(page, "the public call");

  await page.goto("/credits/c1.1.2.3");
  await expect(page.locator("h1")).toBeVisible();
  await expectNoSidewaysScroll(page, "a credit link");
});

test("a contributor's screens fit a phone", async ({ page }) => {
  const bea = demoAccount("bea");
  await signInWithPassword(page, bea.email, bea.password);
  await expectNoSidewaysScroll(page, "the studio home");

  await page.goto(`/calls/${slug}/submit`);
  await expect(page.locator("h1")).toBeVisible();
  await expectNoSidewaysScroll(page, "the submit page");

  await page.goto(`/studio/${slug}/my-pieces`);
  const firstPiece = page.getByTestId("my-piece-link").first();
  await expect(firstPiece).toBeVisible();
  await expectNoSidewaysScroll(page, "my pieces");
  await firstPiece.click();
  await expect(page.getByTestId("my-piece-page")).toBeVisible();
  await expectNoSidewaysScroll(page, "the piece page");
});

test("the lead's screens fit a phone", async ({ page }) => {
  test.slow(); // twelve screens in one walk
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await expectNoSidewaysScroll(page, "the studio home");

  await page.goto(`/studio/${slug}`);
  await expect(page.locator("h1")).toBeVisible();
  await expectNoSidewaysScroll(page, "the overview");

  await page.goto(`/studio/${slug}/call`);
  await expect(page.locator("h1")).toBeVisible();
  await expectNoSidewaysScroll(page, "the call editor");

  await page.goto(`/studio/${slug}/members`);
  await expect(page.locator("h1")).toBeVisible();
  await expectNoSidewaysScroll(page, "members");

  await page.goto(`/studio/${slug}/submissions`);
  const rows = page.getByTestId("submission-row");
  await expect(rows.first()).toBeVisible();
  await expectNoSidewaysScroll(page, "the submissions table");

  // The table scrolls inside its own box; when it does, the hint and the edge fade say so.
  const box = page.getByTestId("scroll-box");
  const overflows = await box.evaluate((el) => el.scrollWidth > el.clientWidth + 1);
  if (overflows) {
    await expect(page.getByTestId("scroll-hint")).toBeVisible();
    await expect(page.getByTestId("scroll-hint")).toHaveText(/Scroll sideways for more columns/);
    await expect(page.getByTestId("scroll-fade")).toBeVisible();
  } else {
    await expect(page.getByTestId("scroll-hint")).toHaveCount(0);
  }

  // The pager stays on one line: no taller than its tallest control.
  const pager = page.getByTestId("pager");
  await expect(pager).toBeVisible();
  const heights = await pager.evaluate((nav) => ({
    nav: nav.getBoundingClientRect().height,
    line: Math.max(...[...nav.children].map((c) => c.getBoundingClientRect().height)),
  }));
  expect(
    heights.nav,
    `pager is ${heights.nav} px tall, one line is ${heights.line} px`,
  ).toBeLessThanOrEqual(heights.line + 1);

  await rows.getByTestId("piece-link").first().click();
  await expect(page.getByTestId("piece-title")).toBeVisible();
  await expectNoSidewaysScroll(page, "the piece detail");

  await page.goto(`/studio/${slug}/credits`);
  await expect(page.getByTestId("credits-preview")).toBeVisible();
  await expectNoSidewaysScroll(page, "the credits screen");

  await page.goto(`/studio/${slug}/map`);
  await expect(page.getByTestId("map-screen")).toBeVisible();
  await expect(page.getByTestId("view-reader")).toHaveAttribute("aria-pressed", "true");
  await expectNoSidewaysScroll(page, "the map, as read");
  await page.getByTestId("view-sheets").click();
  await expect(page.getByTestId("view-sheets")).toHaveAttribute("aria-pressed", "true");
  await expectNoSidewaysScroll(page, "the map, as printed");

  await page.goto(`/studio/${slug}/print`);
  await expect(page.getByTestId("preflight-list")).toBeVisible();
  await expect(page.getByTestId("produce")).toBeDisabled();
  await expectNoSidewaysScroll(page, "the print files");

  await page.goto(`/studio/${slug}/run`);
  await expect(page.getByTestId("run-summary")).toBeVisible();
  await expectNoSidewaysScroll(page, "the print run planner");

  await page.goto(`/studio/${slug}/finishing`);
  await expect(page.getByTestId("batch").first()).toBeVisible();
  await expectNoSidewaysScroll(page, "the finishing batches");

  await page.goto(`/studio/${slug}/stock`);
  await expect(page.getByTestId("stock-counts")).toBeVisible();
  await expectNoSidewaysScroll(page, "the stock");
});

test("the sales and payouts screens fit a phone", async ({ page }) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await page.goto(`/studio/${slug}/sales`);
  await expect(page.getByTestId("sales")).toBeVisible();
  await expectNoSidewaysScroll(page, "sales");
  await page.goto(`/studio/${slug}/payouts`);
  await expect(page.getByTestId("person-ledger").first()).toBeVisible();
  await expectNoSidewaysScroll(page, "payouts");

  await page.context().clearCookies();
  const bea = demoAccount("bea");
  await signInWithPassword(page, bea.email, bea.password);
  await page.goto(`/studio/${slug}/my-payouts`);
  await expect(page.getByTestId("my-totals")).toBeVisible();
  await expectNoSidewaysScroll(page, "my payouts");
});
