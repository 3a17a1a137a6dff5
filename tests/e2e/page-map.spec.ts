import { expect, test, type Locator, type Page } from "@playwright/test";
import type mysql from "mysql2/promise";
import { demoAccount } from "../helpers/demo";
import {
  connect,
  createAnthology,
  createPerson,
  createPiece,
  type FixturePerson,
} from "../helpers/review-fixtures";
import { signInWithPassword } from "./helpers";

// A fresh 16-page anthology led by the demo lead, with accepted pieces of its own, so the test
// does not depend on (or disturb) the demo almanac's map.
const tag = `Pm${Date.now().toString(36)}`;
let conn: mysql.Connection;
let artist: FixturePerson;
let anthology: { id: number; slug: string };
const ids = { drift: 0, kelp: 0, tide: 0, gull: 0 };

// Tall enough that the whole 16-page map and the tray fit, so dragging never needs to scroll.
test.use({ viewport: { width: 1400, height: 1500 } });

test.beforeAll(async () => {
  conn = await connect();
  const lead = demoAccount("odile");
  const [rows] = await conn.query<mysql.RowDataPacket[]>("SELECT id FROM user WHERE email = ?", [
    lead.email,
  ]);
  const leadId = rows[0]?.id as string | undefined;
  if (!leadId) throw new Error("the demo lead is not seeded");
  const [finishers] = await conn.query<mysql.RowDataPacket[]>(
    "SELECT id FROM user WHERE email = ?",
    [demoAccount("cass").email],
  );
  const finisherId = finishers[0]?.id as string | undefined;
  if (!finisherId) throw new Error("the demo finisher is not seeded");
  artist = await createPerson(conn, `Rosalind Quay ${tag}`, "rosalind");
  anthology = await createAnthology(conn, `Map Trial ${tag}`, leadId, [
    { userId: leadId, role: "lead" },
    { userId: artist.id, role: "contributor" },
    { userId: finisherId, role: "finisher" },
  ]);
  const accepted = {
    contributorId: artist.id,
    status: "accepted" as const,
    verdict: "pass" as const,
  };
  ids.drift = await createPiece(conn, anthology.id, {
    ...accepted,
    title: `Driftwood ${tag}`,
    inks: ["black"],
  });
  ids.kelp = await createPiece(conn, anthology.id, {
    ...accepted,
    title: `Kelp ${tag}`,
    inks: ["teal"],
  });
  ids.tide = await createPiece(conn, anthology.id, {
    ...accepted,
    title: `Tide Spread ${tag}`,
    kind: "spread",
    pageCount: 2,
    inks: ["teal"],
  });
  ids.gull = await createPiece(conn, anthology.id, {
    ...accepted,
    title: `Gull ${tag}`,
    inks: ["black", "teal"],
  });
});

test.afterAll(async () => {
  // The anthology takes its slots, history, pieces and memberships with it.
  if (anthology) await conn.query("DELETE FROM anthology WHERE id = ?", [anthology.id]);
  if (artist) await conn.query("DELETE FROM user WHERE id = ?", [artist.id]);
  await conn?.end();
});

async function dragTo(page: Page, source: Locator, target: Locator) {
  await source.scrollIntoViewIfNeeded();
  const from = await source.boundingBox();
  const to = await target.boundingBox();
  if (!from || !to) throw new Error("drag source or target is not on screen");
  await page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
  await page.mouse.down();
  await page.mouse.move(from.x + from.width / 2 + 12, from.y + from.height / 2 + 12, { steps: 4 });
  await page.mouse.move(to.x + to.width / 2, to.y + to.height / 2, { steps: 12 });
  await page.mouse.up();
}

test("the lead places pieces by drag and by keyboard, sees the rules, and accepts a proposal", async ({
  page,
}) => {
  test.slow(); // one long walk through the screen: sign-in, three placements, a refusal, a proposal
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await page.goto(`/studio/${anthology.slug}/map`);
  const screen = page.getByTestId("map-screen");
  await expect(screen).toHaveAttribute("data-ready", "true");
  await expect(screen).toHaveAttribute("data-version", "0");
  await expect(page.getByTestId("slot-1")).toHaveAttribute("data-reservation", "cover");
  await expect(page.getByTestId("slot-16")).toHaveAttribute("data-reservation", "cover");
  await expect(
    page.locator('[data-testid="rule-message"][data-code="piece-not-placed"]'),
  ).toHaveCount(4);

  // By drag: Driftwood onto page 4.
  await dragTo(page, page.getByTestId(`tray-piece-${ids.drift}`), page.getByTestId("slot-4"));
  await expect(page.getByTestId("slot-4")).toHaveAttribute("data-piece", String(ids.drift));
  await expect(screen).toHaveAttribute("data-version", "1");
  await expect(page.getByTestId(`tray-piece-${ids.drift}`)).toHaveCount(0);

  // By keyboard: focus Kelp in the tray, Enter, type page 6, confirm.
  await page.getByTestId(`tray-piece-${ids.kelp}`).focus();
  await page.keyboard.press("Enter");
  const dialog = page.getByTestId("place-dialog");
  await expect(dialog).toBeVisible();
  await page.getByTestId("place-typed").fill("6");
  await page.keyboard.press("Enter");
  await expect(dialog).toHaveCount(0);
  await expect(page.getByTestId("slot-6")).toHaveAttribute("data-piece", String(ids.kelp));
  await expect(screen).toHaveAttribute("data-version", "2");
  // Focus lands on the page the piece went to, not on the page body (WCAG 2.2 SC 2.4.3).
  await expect(page.getByTestId("slot-select-6")).toBeFocused();

  // A spread dropped on a right-hand page is refused with the rule in plain words, and nothing is saved.
  await dragTo(page, page.getByTestId(`tray-piece-${ids.tide}`), page.getByTestId("slot-9"));
  const feedback = page.getByTestId("map-feedback");
  await expect(feedback).toHaveAttribute("data-tone", "error");
  await expect(feedback).toContainText("is a spread");
  await expect(page.getByTestId("slot-9")).toHaveAttribute("data-piece", "");
  await expect(screen).toHaveAttribute("data-version", "2");
  // The same spread on the left-hand page 8 goes in; the refusal gives way and its "not placed" rule clears.
  await dragTo(page, page.getByTestId(`tray-piece-${ids.tide}`), page.getByTestId("slot-8"));
  await expect(feedback).toHaveAttribute("data-tone", "info");
  await expect(page.getByTestId("slot-9")).toHaveAttribute("data-piece", String(ids.tide));
  await expect(
    page.locator('[data-testid="rule-message"][data-code="piece-not-placed"]'),
  ).toHaveCount(1);
  await expect(screen).toHaveAttribute("data-version", "3");

  // The sheet view counts passes; the proposal places what is left, and accepting it changes the count.
  await page.getByTestId("view-sheets").click();
  const perCopy = page.getByTestId("passes-per-copy");
  await expect(perCopy).toBeVisible();
  const before = Number(await perCopy.textContent());
  await page.getByTestId("propose").click();
  const proposal = page.getByTestId("proposal-panel");
  await expect(proposal).toBeVisible({ timeout: 30_000 }); // the server searches arrangements
  await expect(page.getByTestId("proposal-placed")).toContainText(`Gull ${tag}`);
  // Shown, not saved: the map is still at the version before the proposal.
  await expect(screen).toHaveAttribute("data-version", "3");
  await page.getByTestId("proposal-accept").click();
  await expect(proposal).toHaveCount(0);
  await expect(screen).toHaveAttribute("data-version", "4");
  await expect(page.getByTestId("tray-empty")).toBeVisible();
  await expect(perCopy).not.toHaveText(String(before));
  expect(Number(await perCopy.textContent())).toBeGreaterThan(before);
  await expect(page.getByTestId("map-history")).toContainText("Accepted a proposal");
});

test("the finisher sees the map and its sheets but cannot change them", async ({ page }) => {
  const finisher = demoAccount("cass");
  await signInWithPassword(page, finisher.email, finisher.password);
  await page.goto(`/studio/${anthology.slug}/map`);
  const screen = page.getByTestId("map-screen");
  await expect(screen).toHaveAttribute("data-ready", "true");
  await expect(page.getByTestId("slot-1")).toHaveAttribute("data-reservation", "cover");
  await expect(page.getByTestId("propose")).toHaveCount(0);
  await expect(page.locator('[data-testid^="tray-place-"]')).toHaveCount(0);
  await page.getByTestId("slot-select-1").click();
  await expect(page.getByTestId("slot-panel")).toBeVisible();
  await expect(page.getByTestId("slot-lock")).toHaveCount(0);
  await page.getByTestId("view-sheets").click();
  await expect(page.getByTestId("sheet-1")).toBeVisible();
});
