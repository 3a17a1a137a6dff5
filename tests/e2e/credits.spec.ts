import AxeBuilder from "@axe-core/playwright";
import { expect, test, type Page } from "@playwright/test";
import { readFileSync } from "node:fs";
import { demoAccount } from "../helpers/demo";
import { extractLinks, waitForMessage } from "../helpers/outbox";
import { signInWithPassword } from "./helpers";

const slug = "low-tide-almanac";
const people: { name: string; email: string }[] = JSON.parse(
  readFileSync(new URL("../../db/demo-accounts.json", import.meta.url), "utf8"),
);

async function expectNoAxeViolations(page: Page, screen: string) {
  const { violations } = await new AxeBuilder({ page }).analyze();
  expect(
    violations.map((v) => `${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`),
    `${screen} has accessibility problems`,
  ).toEqual([]);
}

/** Bea's first placed piece with a neighbour that is not public yet: its page URL and the neighbour's title. */
async function findHiddenNeighbour(
  page: Page,
): Promise<{ url: string; title: string; page: string }> {
  await page.goto(`/studio/${slug}/my-pieces`);
  const links = await page
    .getByTestId("my-piece-link")
    .evaluateAll((as) => as.map((a) => (a as HTMLAnchorElement).href));
  for (const url of links) {
    await page.goto(url);
    await expect(page.getByTestId("my-piece-page")).toBeVisible();
    const hidden = page.locator('[data-kind="neighbour"][data-public="false"]');
    if ((await hidden.count()) > 0) {
      const figure = hidden.first();
      const testId = (await figure.getAttribute("data-testid"))!;
      const caption = (await figure.locator("figcaption span").nth(1).textContent())!.trim();
      return { url, title: caption, page: testId };
    }
  }
  throw new Error("the demo seed should leave a neighbour of one of Bea's pieces outstanding");
}

test("a contributor approves from the mail, the editors' count goes down and the proof shows the artwork", async ({
  browser,
}) => {
  test.slow(); // three people, a mail and a walk through Bea's pieces
  const beaContext = await browser.newContext();
  const bea = await beaContext.newPage();
  const beaAccount = demoAccount("bea");
  await signInWithPassword(bea, beaAccount.email, beaAccount.password);
  const hidden = await findHiddenNeighbour(bea);
  const before = bea.getByTestId(hidden.page);
  await expect(before).toContainText(hidden.title);
  await expect(before.locator("img")).toHaveCount(0);
  await expectNoAxeViolations(bea, "the piece page with its proof");

  const editorContext = await browser.newContext();
  const editor = await editorContext.newPage();
  const lead = demoAccount("odile");
  await signInWithPassword(editor, lead.email, lead.password);
  await editor.goto(`/studio/${slug}/credits`);
  const outstanding = Number(await editor.getByTestId("credits-outstanding").textContent());
  expect(outstanding).toBeGreaterThan(0);
  await expectNoAxeViolations(editor, "the credits screen");
  const row = editor.getByTestId(/^credit-row-\d+$/).filter({ hasText: hidden.title });
  await expect(row).toHaveAttribute("data-state", "asked");
  const rowText = (await row.textContent()) ?? "";
  const contributor = people.find((p) => rowText.includes(p.name));
  expect(contributor, rowText).toBeDefined();
  await row.getByRole("button", { name: /^Ask again/ }).click();
  await expect(editor.getByTestId("credits-message")).toContainText("Asked 1 contributor");

  const mail = await waitForMessage({ to: contributor!.email, subject: /Approve your credit/ });
  expect(mail.text).toContain(hidden.title);
  const link = extractLinks(mail.text).find((l) => l.includes("/credits/"))!;

  // Signed out: the link is the key.
  const strangerContext = await browser.newContext();
  const stranger = await strangerContext.newPage();
  await stranger.goto(link);
  await expect(stranger.getByTestId("credit-link")).toContainText(hidden.title);
  await expectNoAxeViolations(stranger, "the credit approval page");
  await stranger.getByRole("button", { name: "Approve this credit line" }).click();
  await expect(stranger.getByTestId("credit-approved")).toBeVisible();
  // Opened again, it says so plainly and offers nothing.
  await stranger.goto(link);
  await expect(stranger.getByTestId("credit-link-problem")).toHaveAttribute(
    "data-state",
    "approved",
  );
  await expect(stranger.getByRole("button")).toHaveCount(0);
  await expectNoAxeViolations(stranger, "a used credit link");

  await editor.reload();
  await expect(editor.getByTestId("credits-outstanding")).toHaveText(String(outstanding - 1));
  await expect(row).toHaveAttribute("data-state", "approved");
  await expect(editor.getByTestId("credits-preview")).toContainText(hidden.title);

  await bea.goto(hidden.url);
  const after = bea.getByTestId(hidden.page);
  await expect(after).toHaveAttribute("data-public", "true");
  const img = after.locator("img");
  await expect(img).toBeVisible();
  await expect
    .poll(() => img.evaluate((el) => (el as HTMLImageElement).naturalWidth))
    .toBeGreaterThan(0);

  await Promise.all([beaContext.close(), editorContext.close(), strangerContext.close()]);
});

test("the page map shows each placed page's artwork with its title", async ({ page }) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await page.goto(`/studio/${slug}/map`);
  await expect(page.getByTestId("map-screen")).toBeVisible();
  const thumb = page.locator('[data-testid^="slot-thumb-"]').first();
  await expect(thumb).toBeVisible();
  expect(await thumb.getAttribute("alt")).toBeTruthy();
  await expect
    .poll(() => thumb.evaluate((el) => (el as HTMLImageElement).naturalWidth))
    .toBeGreaterThan(0);
  await page.getByTestId("view-sheets").click();
  await expect(page.locator('[data-testid^="sheet-thumb-"]').first()).toBeVisible();
});

test("a link that is not ours says so without a form", async ({ page }) => {
  await page.goto("/credits/c1.1.2.3");
  await expect(page.getByTestId("credit-link-problem")).toHaveAttribute("data-state", "invalid");
  await expect(page.getByRole("button")).toHaveCount(0);
});
