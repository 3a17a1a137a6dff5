// Script-, markup-, SQL- and template-like text typed by editors and contributors is stored and
// shown back literally: as text on every screen that shows it, with no script run, no element
// injected, no Content-Security-Policy violation, and the data still there on the next load.
// Everything happens on a fresh anthology this spec makes, never on the demo ones.
import { expect, test, type APIRequestContext, type Page } from "@playwright/test";
import { demoAccount, uniqueEmail } from "../helpers/demo";
import { recordCspViolations } from "./csp";
import { halfLetterAnthology, signInWithPassword } from "./helpers";

/** The four hostile strings, in one line that fits every field below (at most 120 characters with a label). */
const HOSTILE = `<script>window.__xss=1</script> "><img src=x onerror="window.__xss=1"> '; DROP TABLE piece; -- {{7*7}}`;
const shown = (label: string) => `${label} ${HOSTILE}`;

async function json(request: APIRequestContext, method: string, url: string, data?: unknown) {
  const response = await request.fetch(url, { method, data });
  const body = await response.json();
  expect(
    response.ok(),
    `${method} ${url} answered ${response.status()}: ${JSON.stringify(body)}`,
  ).toBe(true);
  return body;
}

/** Watches a page for any sign that stored text ran: dialogs, CSP violations. */
async function watch(page: Page) {
  const dialogs: string[] = [];
  page.on("dialog", (dialog) => {
    dialogs.push(dialog.message());
    void dialog.dismiss();
  });
  const violations = await recordCspViolations(page);
  return { dialogs, violations };
}

/** Opens a screen and checks each text is there literally and nothing ran or was injected. */
async function expectShownAsText(page: Page, url: string, texts: string[]) {
  await page.goto(url);
  // Shown as text, or as the value of a field the person may edit.
  const shownText = () =>
    page.evaluate(() =>
      [
        document.body.innerText,
        ...[...document.querySelectorAll("input, textarea")].map(
          (f) => (f as HTMLInputElement).value,
        ),
      ]
        .join("\n")
        .replace(/\s+/g, " "),
    );
  for (const text of texts)
    await expect.poll(shownText, { message: `${url}: ${text}`, timeout: 10_000 }).toContain(text);
  expect(await page.evaluate(() => (window as unknown as { __xss?: unknown }).__xss), url).toBe(
    undefined,
  );
  // Neither the image nor a script came out of the text as elements.
  await expect(page.locator('img[src="x"]'), url).toHaveCount(0);
  expect(
    await page.evaluate(
      () => [...document.scripts].filter((s) => s.textContent?.trim() === "window.__xss=1").length,
    ),
    url,
  ).toBe(0);
}

test("hostile text in titles, names, notes and run records is shown literally and never runs", async ({
  browser,
}) => {
  test.setTimeout(180_000);
  const odile = demoAccount("odile");
  const lead = await browser.newContext();
  const leadPage = await lead.newPage();
  const leadSeen = await watch(leadPage);
  await signInWithPassword(leadPage, odile.email, odile.password);
  const request = leadPage.request;

  // The lead's anthology and its call.
  const { anthology } = await json(
    request,
    "POST",
    "/api/anthologies",
    halfLetterAnthology(shown("Title"), ["black"]),
  );
  const slug: string = anthology.slug;
  const { form } = await json(request, "GET", `/api/anthologies/${slug}/call`);
  const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
  const inAWeek = new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);
  await json(request, "PUT", `/api/anthologies/${slug}/call`, {
    ...form,
    theme: shown("Theme"),
    brief: shown("Brief"),
    opensAt: `${yesterday}T09:00`,
    timeZone: "UTC",
  });
  await json(request, "POST", `/api/anthologies/${slug}/stage`, { to: "call-open" });

  // A contributor signs up from the call with a hostile name and sends a piece through the form.
  const contributor = await browser.newContext();
  const page = await contributor.newPage();
  const seen = await watch(page);
  await page.goto(`/calls/${slug}`);
  await expect(page.locator("body")).toContainText(shown("Theme"));
  await page.getByTestId("send-work").click();
  await page.waitForURL(/\/sign-in\?callbackUrl=/, { timeout: 45_000 });
  await page.getByRole("main").getByRole("link", { name: "Create an account" }).click();
  await page.locator("#name").fill(shown("Name"));
  await page.locator("#email").fill(uniqueEmail("hostile"));
  await page.locator("#password").fill("brackets-and-quotes-2031");
  await page.getByRole("button", { name: "Create account" }).click();
  await page.waitForURL(new RegExp(`/calls/${slug}/submit$`), { timeout: 45_000 });
  await page.locator("#title").fill(shown("Piece"));
  await page.getByTestId("kind-single").check();
  await page.locator("#creditLine").fill(shown("Credit"));
  await page.getByTestId("save-piece").click();
  await page.waitForURL(new RegExp(`/studio/${slug}/my-pieces/\\d+$`), { timeout: 45_000 });
  const pieceId = Number(new URL(page.url()).pathname.split("/").pop());
  await expect(page.getByTestId("piece-title")).toHaveText(shown("Piece"));

  // The lead's own records: an editors' note, a run event, a price list and a sale.
  await json(request, "POST", `/api/pieces/${pieceId}/notes`, { body: shown("Note") });
  // The credits screen lists accepted pieces: accept it though its pages are not in yet.
  await json(request, "POST", `/api/pieces/${pieceId}/status`, { to: "accepted", confirm: true });
  await json(request, "POST", `/api/anthologies/${slug}/run/events`, {
    name: shown("Event"),
    kind: "fair",
    date: inAWeek,
    copies: 10,
  });
  await json(request, "POST", `/api/anthologies/${slug}/run/price-lists`, {
    name: shown("Prices"),
    prices: {
      insidePaper: { priceCents: 1200, perQuantity: 500 },
      coverPaper: { priceCents: 900, perQuantity: 100 },
      copyShopSide: { priceCents: 10, perQuantity: 1 },
      inkPass: { priceCents: 50, perQuantity: 1 },
      master: { priceCents: 120, perQuantity: 1 },
      staples: { priceCents: 300, perQuantity: 1000 },
      finishingCentsPerHour: 1500,
      spoilageBasisPoints: 500,
    },
  });
  await json(request, "POST", `/api/anthologies/${slug}/sales`, {
    channel: "event",
    label: shown("Sale"),
    soldOn: yesterday,
    copies: 2,
    unitPriceCents: 800,
    note: shown("Sale note"),
  });

  // Every screen that shows them: the public call, the studio, review, credits, members, run, sales.
  await expectShownAsText(page, `/calls/${slug}`, [shown("Title"), shown("Theme"), shown("Brief")]);
  await expectShownAsText(page, `/studio/${slug}/my-pieces/${pieceId}`, [
    shown("Piece"),
    shown("Credit"),
  ]);
  await expectShownAsText(leadPage, "/studio", [shown("Title")]);
  await expectShownAsText(leadPage, `/studio/${slug}`, [shown("Title")]);
  await expectShownAsText(leadPage, `/studio/${slug}/submissions`, [shown("Piece"), shown("Name")]);
  await expectShownAsText(leadPage, `/studio/${slug}/submissions/${pieceId}`, [
    shown("Piece"),
    shown("Credit"),
    shown("Note"),
  ]);
  await expectShownAsText(leadPage, `/studio/${slug}/credits`, [shown("Credit")]);
  await expectShownAsText(leadPage, `/studio/${slug}/members`, [shown("Name")]);
  await expectShownAsText(leadPage, `/studio/${slug}/run`, [shown("Event"), shown("Prices")]);
  await expectShownAsText(leadPage, `/studio/${slug}/sales`, [shown("Sale"), shown("Sale note")]);

  // The tables are all still there: the next loads read the same rows back.
  const { rows } = await json(request, "GET", `/api/anthologies/${slug}/submissions`);
  expect(
    (rows as { title: string; creditLine: string; contributor: { name: string } }[]).map((r) => [
      r.title,
      r.creditLine,
      r.contributor.name,
    ]),
  ).toEqual([[shown("Piece"), shown("Credit"), shown("Name")]]);
  await leadPage.reload();
  await expect(leadPage.locator("body")).toContainText(shown("Sale note"));
  await expectShownAsText(page, "/studio", [shown("Title")]);

  expect([...leadSeen.dialogs, ...seen.dialogs], "dialogs opened").toEqual([]);
  expect([...leadSeen.violations, ...seen.violations], "CSP violations").toEqual([]);
  await contributor.close();
  await lead.close();
});
