// A contributor to a duplicator anthology sends a two-ink page as one greyscale master per ink:
// one upload control per ink, each with its own progress and report, and the piece passes only
// once both masters are in.
import { mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { expect, test, type APIRequestContext } from "@playwright/test";
import sharp from "sharp";
import { demoAccount } from "../helpers/demo";
import { halfLetterAnthology, signInWithPassword } from "./helpers";

let workDir: string;
test.beforeAll(() => {
  workDir = mkdtempSync(join(tmpdir(), "quireline-separations-"));
});
test.afterAll(() => {
  rmSync(workDir, { recursive: true, force: true });
});

/**
 * A greyscale master at 300 ppi: half letter with 1/8 in bleed is 5.75 x 8.75 in = 1725 x 2625 px
 * (pixels = inches x ppi, as in the Haematologica "Image resolution" advisor,
 * submit.haematologica.org/image_analysis/advisor/image_resolution.html).
 */
async function masterPng(name: string, grey: number): Promise<string> {
  const file = join(workDir, name);
  await sharp({
    create: { width: 1725, height: 2625, channels: 3, background: { r: grey, g: grey, b: grey } },
  })
    .toColourspace("b-w")
    .withDensity(300)
    .png()
    .toFile(file);
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

test("a contributor uploads a black and a teal master for a two-ink page and sees both checked", async ({
  browser,
}) => {
  test.setTimeout(180_000);
  // Odile opens a fresh call on a black-and-teal duplicator anthology.
  const odile = demoAccount("odile");
  const editor = await browser.newContext();
  const editorPage = await editor.newPage();
  await signInWithPassword(editorPage, odile.email, odile.password);
  const title = `Two Drums ${Date.now().toString(36)}`;
  const { anthology } = await json(
    editorPage.request,
    "POST",
    "/api/anthologies",
    halfLetterAnthology(title),
  );
  const slug: string = anthology.slug;
  const { form } = await json(editorPage.request, "GET", `/api/anthologies/${slug}/call`);
  const yesterday = new Date(Date.now() - 86_400_000).toISOString().slice(0, 10);
  await json(editorPage.request, "PUT", `/api/anthologies/${slug}/call`, {
    ...form,
    theme: "Two inks, two drums",
    brief: "Work in black and teal for the duplicator, one master per ink.",
    opensAt: `${yesterday}T09:00`,
    timeZone: "UTC",
  });
  await json(editorPage.request, "POST", `/api/anthologies/${slug}/stage`, { to: "call-open" });
  await editor.close();

  // Bea sends a one-page piece in both inks.
  const bea = demoAccount("bea");
  const context = await browser.newContext();
  const page = await context.newPage();
  await signInWithPassword(page, bea.email, bea.password);
  const created = await json(page.request, "POST", `/api/anthologies/${slug}/pieces`, {
    title: "Kelp in Two Inks",
    kind: "single",
    pageCount: 1,
    inks: ["black", "teal"],
    creditLine: "Bea Okonkwo-Hale",
    altTexts: ["Kelp fronds in black over a teal sea."],
  });
  await page.goto(created.url);
  await expect(page.getByTestId("piece-verdict")).toHaveAttribute("data-verdict", "missing");
  await expect(page.getByTestId("separations-explained")).toContainText(
    "one per ink (black and teal)",
  );
  await expect(page.getByRole("heading", { name: "Page 1 — black master" })).toBeVisible();
  await expect(page.getByRole("heading", { name: "Page 1 — teal master" })).toBeVisible();
  await expect(page.getByTestId("files-missing")).toContainText("2 masters still to send");

  await page
    .getByTestId("upload-input-1-black")
    .setInputFiles(await masterPng("kelp-black.png", 60));
  const black = page.getByTestId("report-1-black");
  await expect(black).toHaveAttribute("data-verdict", "pass", { timeout: 45_000 });
  await expect(page.getByTestId("overlay-1-black").locator("image")).toHaveCount(1);
  await expect(page.getByTestId("report-1-black-ink")).toContainText("Checked as the black master");
  // One ink in, one to go: the piece's files are still missing.
  await expect(page.getByTestId("piece-verdict")).toHaveAttribute("data-verdict", "missing");
  await expect(page.getByTestId("no-file-1-teal")).toBeVisible();

  await page
    .getByTestId("upload-input-1-teal")
    .setInputFiles(await masterPng("kelp-teal.png", 150));
  const teal = page.getByTestId("report-1-teal");
  await expect(teal).toHaveAttribute("data-verdict", "pass", { timeout: 45_000 });
  await expect(page.getByTestId("overlay-1-teal").locator("image")).toHaveCount(1);
  await expect(page.getByTestId("piece-verdict")).toHaveAttribute("data-verdict", "pass");
  await expect(page.getByTestId("files-missing")).toHaveCount(0);
  await context.close();
});
