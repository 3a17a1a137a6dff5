import { expect, test } from "@playwright/test";
import sharp from "sharp";
import { utcToZonedLocal } from "../../lib/time-zones";
import { demoAccount } from "../helpers/demo";
import { halfLetterAnthology, signInWithPassword } from "./helpers";

const DAY = 86_400_000;
const ZONE = "Europe/Lisbon";
const lisbon = (offsetMs: number) => utcToZonedLocal(new Date(Date.now() + offsetMs), ZONE);

test("a lead writes and opens a call; a stranger reads it and downloads the PNG template", async ({
  page,
  browser,
}) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  const created = await page.request.post("/api/anthologies", {
    data: halfLetterAnthology(`Breakwater Notes ${Date.now().toString(36)}`),
  });
  expect(created.status()).toBe(201);
  const { slug } = (await created.json()).anthology as { slug: string };

  const stranger = await browser.newContext();
  const visitor = await stranger.newPage();
  expect((await visitor.goto(`/calls/${slug}`))?.status(), "an unpublished call is not found").toBe(
    404,
  );

  await page.goto(`/studio/${slug}/call`);
  await expect(page.getByTestId("call-phase")).toContainText("Not published yet");
  await expect(page.getByTestId("stage-problems")).toContainText(
    "Write and save the open call first.",
  );
  await expect(page.getByRole("button", { name: "Open the call" })).toBeDisabled();

  await expect(page.getByTestId("call-form")).toHaveAttribute("data-ready", "true");
  await page.locator("#theme").fill("Breakwater at dawn");
  await page
    .locator("#brief")
    .fill(
      "Prints and drawings of the harbour wall at first light: gulls, rust, rope and the ferry coming in.",
    );
  await page.locator("#timeZone").selectOption(ZONE);
  await page.locator("#opensAt").fill(lisbon(-DAY));
  await page.locator("#closesAt").fill(lisbon(-2 * DAY));
  await page.getByRole("button", { name: "Save the call" }).click();
  await expect(page.getByTestId("error-closesAt")).toHaveText("The call must close after it opens");

  await page.locator("#closesAt").fill(lisbon(14 * DAY));
  await page.locator("#feeKind").selectOption("per-piece");
  await page.locator("#fee").fill("30");
  await page.locator("#salesSharePercent").fill("10");
  await page.locator("#contributorCopies").fill("2");
  await page.getByRole("button", { name: "Save the call" }).click();
  await expect(page.getByTestId("call-saved")).toBeVisible();
  // The stage panel is drawn on the server: it lets the call open once the saved call is re-read.
  await expect(page.getByTestId("stage-problems")).toHaveCount(0);

  await page.getByRole("button", { name: "Open the call" }).click();
  await expect(page.getByTestId("stage-confirm")).toContainText("cannot be undone");
  await page.getByRole("button", { name: "Yes, open the call" }).click();
  await expect(page.getByTestId("stage-current")).toHaveText("Now: Call open");
  await expect(page.getByTestId("call-phase")).toContainText("Open: taking work until");
  await expect(page.getByTestId("public-call-link")).toHaveText(new RegExp(`/calls/${slug}$`));

  await visitor.goto(`/calls/${slug}`);
  await expect(visitor.getByTestId("call-theme")).toHaveText("Breakwater at dawn");
  await expect(visitor.getByTestId("call-status")).toContainText("Open for work");
  await expect(visitor.getByTestId("call-details")).toContainText(`(${ZONE}, UTC`);
  await expect(visitor.getByTestId("call-terms")).toContainText("$30.00 per piece");
  await expect(visitor.getByTestId("call-terms")).toContainText("10 % of net sales");
  await expect(visitor.getByTestId("spec-colour")).toHaveText(
    "One greyscale file per ink (black, teal), dark where that ink prints",
  );
  await expect(visitor.getByTestId("send-work")).toHaveAttribute("href", `/calls/${slug}/submit`);

  const [download] = await Promise.all([
    visitor.waitForEvent("download"),
    visitor.getByTestId("template-png").click(),
  ]);
  expect(download.suggestedFilename()).toBe(`${slug}-page-template-1725x2625px-300ppi.png`);
  const meta = await sharp(await download.path()).metadata();
  // Half letter + 0.125 in bleed at 300 ppi = 5.75 x 8.75 in x 300 = 1725 x 2625 px (pixels = inches x ppi,
  // Haematologica "Image resolution" advisor, submit.haematologica.org/image_analysis/advisor/image_resolution.html).
  expect([meta.format, meta.width, meta.height]).toEqual(["png", 1725, 2625]);
  await stranger.close();
});

test("the landing page links to the demo almanac's open call", async ({ page }) => {
  await page.goto("/");
  await page
    .getByTestId("open-calls")
    .getByRole("link", { name: /Low Tide Almanac.s open call/ })
    .click();
  await expect(page).toHaveURL(/\/calls\/low-tide-almanac$/);
  await expect(page.getByTestId("call-theme")).toHaveText("What the tide leaves");
  await expect(page.getByTestId("call-terms")).toContainText("$25.00 per piece");
  expect((await page.goto("/calls/no-such-call-in-lanternfield"))?.status()).toBe(404);
});
