import { execFileSync } from "node:child_process";
import { expect, test } from "@playwright/test";
import { demoAccount } from "../helpers/demo";
import { signInWithPassword } from "./helpers";

// The demo comics jam is seeded ready to print (db/seed/print-ready.ts): its lead produces the
// print files from the screen, watches them being made and downloads the finished PDF.
const slug = "heron-street-comics-jam";

test("the lead produces print files, sees their progress and downloads them", async ({ page }) => {
  test.slow();
  const bea = demoAccount("bea");
  await signInWithPassword(page, bea.email, bea.password);
  await page.goto(`/studio/${slug}`);
  await page.getByRole("link", { name: "Print files" }).click();
  await expect(page.getByRole("heading", { name: "Print files", level: 1 })).toBeVisible();

  // Only a warning (one credit line waits for approval): producing is allowed.
  const preflight = page.getByTestId("preflight-list");
  await expect(preflight).toContainText("Warning: 1 credit line is not approved");
  await expect(preflight).not.toContainText("Must fix");
  await expect(page.getByTestId("print-none")).toBeVisible();

  // A6 has no paired sheet: the picker starts on the smallest named sheet its spread fits.
  await expect(page.getByLabel("Letter (8.5 x 11 in) (usual for this trim)")).toBeChecked();
  // Keyboard: the button is reached and pressed without the mouse.
  await page.getByTestId("produce").focus();
  await page.keyboard.press("Enter");

  const progress = page.getByTestId("print-progress");
  await expect(progress.first()).toBeVisible();
  await expect(page.getByRole("progressbar").first()).toHaveAttribute("aria-valuemax", "8");

  const finished = page.getByTestId("print-finished-list");
  await expect(finished).toContainText("heron-street-comics-jam-print-map-v", { timeout: 60_000 });
  await expect(finished).toContainText("heron-street-comics-jam-proof-map-v", { timeout: 60_000 });
  await expect(finished).toContainText("4 pages, on Letter (8.5 x 11 in)");
  await expect(progress).toHaveCount(0);

  const [download] = await Promise.all([
    page.waitForEvent("download"),
    page.getByRole("link", { name: /Download the print file/ }).click(),
  ]);
  expect(download.suggestedFilename()).toMatch(/^heron-street-comics-jam-print-map-v\d+\.pdf$/);
  const path = await download.path();
  expect(path).toBeTruthy();

  // The credits page (page 2) is set from the approved lines only; the colophon on page 7.
  // Read back with poppler's pdftotext, an independent reader.
  const text = execFileSync("pdftotext", ["-layout", path, "-"], { encoding: "utf8" });
  expect(text).toContain("Four Cats, One Window");
  expect(text).toContain("Jam Night");
  expect(text).not.toContain("Last Bus Home");
  expect(text).toContain("Heron Street Drawing Night"); // the press, in the colophon
});
