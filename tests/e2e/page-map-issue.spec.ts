import { expect, test } from "@playwright/test";
import type mysql from "mysql2/promise";
import { demoAccount } from "../helpers/demo";
import { listMessages } from "../helpers/outbox";
import {
  connect,
  createAnthology,
  createPerson,
  createPiece,
  type FixturePerson,
} from "../helpers/review-fixtures";
import { signInWithPassword } from "./helpers";

// A fresh 16-page anthology at "laying out", led by the demo lead: leaving a piece out, the copies
// figure kept over a reload, page notices confirmed before they go, and the move to printing
// naming what is still open.
const tag = `Pi${Date.now().toString(36)}`;
let conn: mysql.Connection;
let artist: FixturePerson;
let anthology: { id: number; slug: string };
const ids = { drift: 0, kelp: 0 };

test.use({ viewport: { width: 1400, height: 1500 } });

test.beforeAll(async () => {
  conn = await connect();
  const [rows] = await conn.query<mysql.RowDataPacket[]>("SELECT id FROM user WHERE email = ?", [
    demoAccount("odile").email,
  ]);
  const leadId = rows[0]?.id as string | undefined;
  if (!leadId) throw new Error("the demo lead is not seeded");
  artist = await createPerson(conn, `Ottilie Marsh ${tag}`, "ottilie");
  anthology = await createAnthology(conn, `Issue Trial ${tag}`, leadId, [
    { userId: leadId, role: "lead" },
    { userId: artist.id, role: "contributor" },
  ]);
  await conn.query("UPDATE anthology SET stage = 'laying-out' WHERE id = ?", [anthology.id]);
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
});

test.afterAll(async () => {
  if (anthology) {
    await conn.query("DELETE FROM email_log WHERE anthology_id = ?", [anthology.id]);
    await conn.query("DELETE FROM anthology WHERE id = ?", [anthology.id]);
  }
  if (artist) await conn.query("DELETE FROM user WHERE id = ?", [artist.id]);
  await conn?.end();
});

test("the lead leaves a piece out, keeps the copies, confirms the notices and sees what is open before printing", async ({
  page,
}) => {
  test.slow();
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password);
  await page.goto(`/studio/${anthology.slug}/map`);
  const screen = page.getByTestId("map-screen");
  await expect(screen).toHaveAttribute("data-ready", "true");
  const notPlaced = page.locator('[data-testid="rule-message"][data-code="piece-not-placed"]');
  await expect(notPlaced).toHaveCount(2);

  // Left out: off the tray and the rules, listed apart, and back again.
  await page.getByTestId(`tray-leave-out-${ids.kelp}`).click();
  await expect(page.getByTestId(`tray-piece-${ids.kelp}`)).toHaveCount(0);
  await expect(page.getByTestId("left-out")).toContainText(`Kelp ${tag}`);
  await expect(notPlaced).toHaveCount(1);
  await expect(screen).toHaveAttribute("data-version", "1");
  await expect(page.getByTestId("map-history")).toContainText("out of this issue");
  await page.getByTestId(`bring-back-${ids.kelp}`).click();
  await expect(page.getByTestId(`tray-piece-${ids.kelp}`)).toBeVisible();
  await expect(page.getByTestId("left-out")).toHaveCount(0);
  await page.getByTestId(`tray-leave-out-${ids.kelp}`).click();
  await expect(screen).toHaveAttribute("data-version", "3");

  // The copies figure is kept with the anthology.
  await page.getByTestId("view-sheets").click();
  await page.getByTestId("copies").fill("240");
  await page.getByTestId("copies").press("Enter");
  await expect(page.getByTestId("copies-note")).toHaveText("Kept: 240 copies.");
  await page.reload();
  await expect(page.getByTestId("map-screen")).toHaveAttribute("data-ready", "true");
  await expect(page.getByTestId("copies")).toHaveValue("240");

  // Place Driftwood on page 4 by keyboard, then ask to e-mail the pages: nothing goes before the confirmation.
  await page.getByTestId(`tray-piece-${ids.drift}`).focus();
  await page.keyboard.press("Enter");
  await page.getByTestId("place-typed").fill("4");
  await page.keyboard.press("Enter");
  await expect(page.getByTestId("slot-4")).toHaveAttribute("data-piece", String(ids.drift));
  await page.getByTestId("send-notices").click();
  const confirm = page.getByTestId("notices-confirm");
  await expect(confirm).toContainText("Send 1 contributor their pages?");
  await expect(page.getByTestId("notice-preview-entry")).toHaveText(
    `Ottilie Marsh ${tag}: “Driftwood ${tag}” on page 4`,
  );
  expect(await listMessages({ to: artist.email })).toHaveLength(0);
  await page.getByTestId("notices-send").click();
  await expect(page.getByTestId("notices-result")).toContainText("Sent 1 notice");
  await expect(confirm).toHaveCount(0);
  await expect.poll(async () => (await listMessages({ to: artist.email })).length).toBe(1);

  // The move to printing names the empty pages before it is confirmed.
  await page.goto(`/studio/${anthology.slug}/call`);
  await page.getByRole("button", { name: "Start printing" }).click();
  const cautions = page.getByTestId("stage-cautions");
  await expect(cautions).toContainText("pages are still empty on the page map");
  await expect(page.getByTestId("stage-confirm")).toContainText("cannot be undone");
});
