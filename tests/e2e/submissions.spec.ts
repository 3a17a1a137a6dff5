// A contributor answers an open call: signs up from the public page, creates a piece, uploads a
// page without bleed, reads the finding and its fix, uploads a corrected file and sees it pass.
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { expect, test, type APIRequestContext } from "@playwright/test";
import { PDFDocument, rgb } from "pdf-lib";
import sharp from "sharp";
import { demoAccount, uniqueEmail } from "../helpers/demo";
import { waitForMessage } from "../helpers/outbox";
import { recordCspViolations } from "./csp";
import { halfLetterAnthology, signInWithPassword } from "./helpers";

let workDir: string;

test.beforeAll(() => {
  workDir = mkdtempSync(join(tmpdir(), "quireline-submissions-"));
});
test.afterAll(() => {
  rmSync(workDir, { recursive: true, force: true });
});

/**
 * A greyscale page at 300 ppi whose mid-grey artwork runs to every edge. Half letter is
 * 1650 x 2550 px at 300 ppi, 1725 x 2625 px with 1/8 in bleed (pixels = inches x ppi, as in the
 * Haematologica "Image resolution" advisor, submit.haematologica.org/image_analysis/advisor/image_resolution.html).
 */
async function pagePng(name: string, widthPx: number, heightPx: number): Promise<string> {
  const file = join(workDir, name);
  await sharp({
    create: {
      width: widthPx,
      height: heightPx,
      channels: 3,
      background: { r: 120, g: 120, b: 120 },
    },
  })
    .toColourspace("b-w")
    .withDensity(300)
    .png()
    .toFile(file);
  return file;
}

/**
 * A one-page PDF at half letter plus 1/8 in bleed, 414 x 630 pt (5.75 x 8.75 in x 72), with the
 * TrimBox 9 pt (1/8 in) inside the MediaBox, built with pdf-lib; the lower half is inked.
 */
async function pagePdf(name: string): Promise<string> {
  const doc = await PDFDocument.create();
  const page = doc.addPage([414, 630]);
  page.drawRectangle({ x: 0, y: 0, width: 414, height: 315, color: rgb(0, 0, 0) });
  page.setTrimBox(9, 9, 396, 612);
  const file = join(workDir, name);
  writeFileSync(file, await doc.save());
  return file;
}

async function json(
  request: APIRequestContext,
  method: "GET" | "POST" | "PUT",
  url: string,
  data?: unknown,
) {
  const response = await request.fetch(url, { method, data });
  const body = await response.json();
  expect(
    response.ok(),
    `${method} ${url} answered ${response.status()}: ${JSON.stringify(body)}`,
  ).toBe(true);
  return body;
}

/** Odile makes a fresh half-letter anthology with a call that opened yesterday, through the app's own API. */
async function openFreshCall(request: APIRequestContext): Promise<string> {
  const title = `Estuary Notes ${Date.now().toString(36)}`;
  const { anthology } = await json(
    request,
    "POST",
    "/api/anthologies",
    halfLetterAnthology(title, ["black"]),
  );
  const slug: string = anthology.slug;
  const { form } = await json(request, "GET", `/api/anthologies/${slug}/call`);
  const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
  await json(request, "PUT", `/api/anthologies/${slug}/call`, {
    ...form,
    theme: "Notes from the estuary",
    brief: "Drawings of the river mouth at low water, printed in black on the duplicator.",
    opensAt: `${yesterday}T09:00`,
    timeZone: "UTC",
  });
  await json(request, "POST", `/api/anthologies/${slug}/stage`, { to: "call-open" });
  return slug;
}

test("a contributor signs up from an open call, uploads a page without bleed, fixes it and passes", async ({
  browser,
}) => {
  // Two uploads, each checked on the server, plus a sign-up: more than the default minute on a busy machine.
  test.setTimeout(180_000);
  const odile = demoAccount("odile");
  const editor = await browser.newContext();
  const editorPage = await editor.newPage();
  await signInWithPassword(editorPage, odile.email, odile.password);
  const slug = await openFreshCall(editorPage.request);
  await editor.close();

  const context = await browser.newContext();
  const page = await context.newPage();
  // The uploads go to the upload host: the page's CSP must let them through.
  const violations = await recordCspViolations(page);
  await page.goto(`/calls/${slug}`);
  await page.getByTestId("send-work").click();
  await page.waitForURL(/\/sign-in\?callbackUrl=/, { timeout: 45_000 });
  await page.getByRole("main").getByRole("link", { name: "Create an account" }).click();

  const email = uniqueEmail("wren");
  await page.locator("#name").fill("Wren Halloway");
  await page.locator("#email").fill(email);
  await page.locator("#password").fill("estuary-mud-2031");
  await page.getByRole("button", { name: "Create account" }).click();
  await page.waitForURL(new RegExp(`/calls/${slug}/submit$`), { timeout: 45_000 });

  await page.locator("#title").fill("Heron at the Sluice Gate");
  await page.getByTestId("kind-single").check();
  await expect(page.getByTestId("ink-black")).toBeChecked();
  await expect(page.locator("#creditLine")).toHaveValue("Wren Halloway");
  await page.locator("#altTexts-0").fill("A heron stands on a sluice gate in thick grey fog.");
  await page.getByTestId("save-piece").click();
  await page.waitForURL(new RegExp(`/studio/${slug}/my-pieces/\\d+$`), { timeout: 45_000 });
  await expect(page.getByTestId("piece-title")).toHaveText("Heron at the Sluice Gate");
  await expect(page.getByTestId("piece-verdict")).toHaveAttribute("data-verdict", "missing");

  // 1650 x 2550 px is the trim without bleed, and the grey runs to every edge.
  await page
    .getByTestId("upload-input-1")
    .setInputFiles(await pagePng("heron-no-bleed.png", 1650, 2550));
  const report = page.getByTestId("report-1");
  const noBleed = report.locator('[data-testid="finding"][data-code="no-bleed"]');
  await expect(noBleed).toBeVisible({ timeout: 30_000 });
  await expect(noBleed).toHaveAttribute("data-severity", "blocker");
  await expect(noBleed).toContainText("1650 x 2550 px");
  await expect(noBleed.getByTestId("finding-fix")).toContainText("1725 x 2625 px");
  await expect(page.getByTestId("piece-verdict")).toHaveAttribute("data-verdict", "blocker");
  await expect(page.getByTestId("overlay-1").locator("image")).toHaveCount(1);

  const mail = await waitForMessage({ to: email, subject: /Spec check/, timeoutMs: 15_000 });
  expect(mail.text).toContain("1725 x 2625 px");

  // The corrected file: trim plus 1/8 in bleed on every side.
  await page
    .getByTestId("upload-input-1")
    .setInputFiles(await pagePng("heron-with-bleed.png", 1725, 2625));
  await expect(report).toHaveAttribute("data-verdict", "pass", { timeout: 30_000 });
  await expect(report.getByTestId("finding")).toHaveCount(0);
  await expect(page.getByTestId("piece-verdict")).toHaveAttribute("data-verdict", "pass");
  // The first version and its report stay visible.
  const older = page.getByTestId("versions-1");
  await older.locator("summary").click();
  await expect(older.getByTestId("older-version")).toHaveCount(1);
  await expect(older.locator('[data-code="no-bleed"]')).toBeVisible();

  // A PDF page is drawn as its preview by the running server.
  const overlayImage = page.getByTestId("overlay-1").locator("image");
  const pngPreview = await overlayImage.getAttribute("href");
  await page.getByTestId("upload-input-1").setInputFiles(await pagePdf("heron.pdf"));
  await expect(overlayImage).not.toHaveAttribute("href", pngPreview ?? "", { timeout: 30_000 });
  const preview = await page.request.get((await overlayImage.getAttribute("href"))!);
  expect(preview.status()).toBe(200);
  const { data, info } = await sharp(await preview.body())
    .greyscale()
    .raw()
    .toBuffer({ resolveWithObject: true });
  // 414 x 630 pt at 480 px on the long side: 315 x 480 px; paper above, ink below.
  expect([info.width, info.height]).toEqual([315, 480]);
  expect(data[100 * info.width + 157]).toBeGreaterThan(200);
  expect(data[380 * info.width + 157]).toBeLessThan(50);

  await page.goto(`/studio/${slug}/my-pieces`);
  await expect(page.getByTestId("my-piece")).toHaveCount(1);
  await expect(page.getByTestId("my-piece")).toContainText("1 of 1 file uploaded");
  expect(violations, violations.join("\n")).toEqual([]);
  await context.close();
});

test("a file chosen before the uploader is ready waits for it, then is sent and checked", async ({
  browser,
}) => {
  test.setTimeout(120_000);
  const odile = demoAccount("odile");
  const editor = await browser.newContext();
  const editorPage = await editor.newPage();
  await signInWithPassword(editorPage, odile.email, odile.password);
  const slug = await openFreshCall(editorPage.request);
  await editor.close();

  const imke = demoAccount("imke");
  const context = await browser.newContext();
  const page = await context.newPage();
  await signInWithPassword(page, imke.email, imke.password);
  const { url } = await json(page.request, "POST", `/api/anthologies/${slug}/pieces`, {
    title: "Moth Lantern",
    kind: "single",
    pageCount: 1,
    inks: ["black"],
    creditLine: "Imke Sallow",
  });

  // Hold back the page's scripts (so it is not live yet) and the uploader's route settings
  // (GET /api/uploadthing) until the test lets each go. Routing also turns the HTTP cache off.
  const hold = () => {
    let release!: () => void;
    const held = new Promise<void>((resolve) => (release = resolve));
    return { held, release };
  };
  const scripts = hold();
  const settings = hold();
  await page.route(
    (address) =>
      address.pathname.startsWith("/_next/static/chunks/") && address.pathname.endsWith(".js"),
    async (route) => {
      await scripts.held;
      await route.fallback();
    },
  );
  await page.route(
    (address) => address.pathname === "/api/uploadthing" && address.search === "",
    async (route) => {
      if (route.request().method() !== "GET") return route.fallback();
      await settings.held;
      await route.fallback();
    },
  );

  await page.goto(url, { waitUntil: "commit" });
  const input = page.getByTestId("upload-input-1");
  // As drawn by the server the control is off and says why.
  await expect(input).toBeDisabled();
  await expect(page.getByTestId("upload-waiting-1")).toContainText("Getting the uploader ready");
  // A file lands in the input all the same (a browser may take it before the page is live).
  await input.setInputFiles(await pagePng("moth-with-bleed.png", 1725, 2625));

  scripts.release();
  // Live, still waiting for the settings: the file is held, and the control takes nothing more.
  await expect(page.getByTestId("upload-waiting-1")).toContainText(
    "“moth-with-bleed.png” will be sent as soon as it is.",
  );
  await expect(input).toBeDisabled();

  settings.release();
  // Once the uploader is ready the held file is sent, checked and its outcome shown.
  await expect(page.getByTestId("upload-outcome-1")).toContainText("Version 1 checked.", {
    timeout: 30_000,
  });
  await expect(page.getByTestId("report-1")).toHaveAttribute("data-verdict", "pass", {
    timeout: 30_000,
  });
  await expect(page.getByTestId("upload-waiting-1")).toHaveCount(0);
  await expect(input).toBeEnabled();
  await context.close();
});
