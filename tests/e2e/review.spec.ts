import { expect, test } from "@playwright/test";
import type mysql from "mysql2/promise";
import { demoAccount } from "../helpers/demo";
import { waitForMessage } from "../helpers/outbox";
import {
  addMember,
  connect,
  createPerson,
  createPiece,
  removePiecesAndPeople,
  type FixturePerson,
} from "../helpers/review-fixtures";
import { signInWithPassword } from "./helpers";

// Pieces of our own in the demo almanac, with a word no other test uses, so this test does not
// depend on (or disturb) the demo seed's pieces.
const tag = `Qz${Date.now().toString(36)}`;
const titles = { a: `Anchor Chain ${tag}`, b: `Bladderwrack ${tag}`, c: `Clam Shell ${tag}` };
let conn: mysql.Connection;
let contributor: FixturePerson;
const pieceIds: number[] = [];

test.beforeAll(async () => {
  conn = await connect();
  contributor = await createPerson(conn, `Marisol Teague ${tag}`, "marisol");
  const almanacId = await addMember(conn, "low-tide-almanac", contributor.id, "contributor");
  pieceIds.push(
    await createPiece(conn, almanacId, {
      title: titles.b,
      contributorId: contributor.id,
      status: "awaiting-review",
      verdict: "pass",
    }),
    await createPiece(conn, almanacId, {
      title: titles.a,
      contributorId: contributor.id,
      status: "awaiting-review",
      verdict: "warning",
      inks: ["black", "teal"],
    }),
    await createPiece(conn, almanacId, {
      title: titles.c,
      contributorId: contributor.id,
      status: "shortlisted",
      verdict: "note",
    }),
  );
});

test.afterAll(async () => {
  await removePiecesAndPeople(conn, pieceIds, contributor ? [contributor] : []);
  await conn.end();
});

test("the lead filters, sorts, opens a piece and accepts it; the contributor is e-mailed", async ({
  page,
}) => {
  test.slow(); // a long walk through two screens
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await page.goto("/studio/low-tide-almanac/submissions");
  const rows = page.getByTestId("submission-row");

  await page.getByLabel("Search").fill(tag);
  await expect(rows).toHaveCount(3);

  // Filter by status: only the two still waiting for a read.
  await page.getByTestId("filter-status").locator("summary").click();
  await page.getByLabel("Waiting for a read").check();
  await expect(page).toHaveURL(/status=awaiting-review/);
  await expect(rows).toHaveCount(2);
  await page.keyboard.press("Escape");

  // Sort by title, A to Z, then Z to A.
  await page.getByTestId("sort-title").click();
  await expect(page).toHaveURL(/sort=title&dir=asc/);
  await expect(rows.getByTestId("piece-link")).toHaveText([titles.a, titles.b]);
  await page.getByTestId("sort-title").click();
  await expect(rows.getByTestId("piece-link")).toHaveText([titles.b, titles.a]);

  // A reload keeps the search, the filter and the sort.
  await page.reload();
  await expect(rows.getByTestId("piece-link")).toHaveText([titles.b, titles.a]);
  await expect(page.getByLabel("Search")).toHaveValue(tag);

  // The row checkboxes are labelled and reachable from the keyboard.
  await page.getByLabel(`Select "${titles.b}"`).focus();
  await page.keyboard.press("Space");
  await page.keyboard.press("ArrowDown");
  await expect(page.getByLabel(`Select "${titles.a}"`)).toBeFocused();
  await page.keyboard.press("Space");
  await expect(page.getByTestId("bulk-bar")).toContainText("2 selected");

  await rows.getByTestId("piece-link").filter({ hasText: titles.a }).click();
  await expect(page.getByTestId("piece-title")).toHaveText(titles.a);
  await expect(page.getByTestId("piece-status")).toHaveText("Waiting for a read");

  await page.getByLabel("In the book").check();
  await page.getByLabel(/Message to Marisol/).fill("It opens the mudflat section.");
  await page.getByRole("button", { name: "Move to “In the book”" }).click();
  // The piece has no files yet: the editor is warned and confirms.
  await expect(page.getByTestId("accept-warning")).toContainText("has no files yet");
  await expect(page.getByTestId("piece-status")).toHaveText("Waiting for a read");
  await page.getByRole("button", { name: "Accept anyway" }).click();
  await expect(page.getByTestId("accept-warning")).toHaveCount(0);
  await expect(page.getByTestId("status-result")).toContainText("has been e-mailed");
  await expect(page.getByTestId("piece-status")).toHaveText("In the book");
  await expect(page.getByTestId("status-history")).toContainText("It opens the mudflat section.");

  const mail = await waitForMessage({
    to: contributor.email,
    subject: new RegExp(`"${titles.a}" is going in Low Tide Almanac`),
  });
  expect(mail.text).toContain("It opens the mudflat section.");
});

test("editors' notes are added on the piece page", async ({ page }) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await page.goto(`/studio/low-tide-almanac/submissions/${pieceIds[2]}`);
  await expect(page.getByTestId("notes-empty")).toBeVisible();
  await page.getByRole("button", { name: "Save note" }).click();
  await expect(page.getByTestId("error-note-body")).toHaveText("Write the note first");
  await page.getByLabel("Add a note").fill(`Pair with the kelp run ${tag}`);
  await page.getByRole("button", { name: "Save note" }).click();
  await expect(page.getByTestId("notes")).toContainText(`Pair with the kelp run ${tag}`);
  await page.reload();
  await expect(page.getByTestId("notes")).toContainText("Odile Farrant");
});

test("a finisher cannot open the submissions", async ({ page }) => {
  const finisher = demoAccount("cass");
  await signInWithPassword(page, finisher.email, finisher.password);
  const response = await page.goto("/studio/low-tide-almanac/submissions");
  expect(response?.status()).toBe(403);
  await expect(page.getByTestId("forbidden")).toBeVisible();
});

test("while a new sort is fetched the stale rows are dimmed and the table says it is updating", async ({
  page,
}) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await page.goto(`/studio/low-tide-almanac/submissions?q=${tag}`);
  const rows = page.getByTestId("submission-row");
  await expect(rows).toHaveCount(3);
  const status = page.getByTestId("submissions-refreshing");
  await expect(status).toHaveText("");

  // Hold the next page back until the test has looked at the table.
  let release!: () => void;
  const held = new Promise<void>((resolve) => (release = resolve));
  await page.route(
    /\/api\/anthologies\/low-tide-almanac\/submissions\?.*sort=title/,
    async (route) => {
      await held;
      await route.continue();
    },
  );

  await page.getByTestId("sort-title").click();
  await expect(status).toHaveText("Updating the list…");
  await expect(page.getByTestId("submissions-table")).toHaveAttribute("aria-busy", "true");
  await expect(page.locator("[data-testid=submissions-table] tbody")).toHaveAttribute(
    "data-stale",
    "true",
  );
  // The previous rows stay readable meanwhile.
  await expect(rows).toHaveCount(3);

  release();
  await expect(status).toHaveText("");
  await expect(page.locator("[data-testid=submissions-table] tbody")).not.toHaveAttribute(
    "data-stale",
    "true",
  );
  await expect(rows.first()).toContainText(titles.a);
});
