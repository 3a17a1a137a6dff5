// The lead changes the print spec of an anthology already laid out: a change that would break the
// page map is refused with the reason, one that costs press passes asks to be confirmed, and the
// confirmed change is saved with its outcome shown.
import { expect, test } from "@playwright/test";
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

const tag = `Sp${Date.now().toString(36)}`;
let conn: mysql.Connection;
let artist: FixturePerson;
let anthology: { id: number; slug: string };

test.beforeAll(async () => {
  conn = await connect();
  const [rows] = await conn.query<mysql.RowDataPacket[]>("SELECT id FROM user WHERE email = ?", [
    demoAccount("odile").email,
  ]);
  const leadId = rows[0]?.id as string | undefined;
  if (!leadId) throw new Error("the demo lead is not seeded");
  artist = await createPerson(conn, `Maren Lisle ${tag}`, "maren");
  // A6, 16 pages, black and teal on a duplicator that lays two inks a pass.
  anthology = await createAnthology(conn, `Spec Trial ${tag}`, leadId, [
    { userId: leadId, role: "lead" },
    { userId: artist.id, role: "contributor" },
  ]);
  await conn.query("UPDATE anthology SET inks_per_pass = 2 WHERE id = ?", [anthology.id]);
  const accepted = {
    contributorId: artist.id,
    status: "accepted" as const,
    verdict: "pass" as const,
  };
  const drift = await createPiece(conn, anthology.id, {
    ...accepted,
    title: `Driftwood ${tag}`,
    inks: ["black"],
  });
  const kelp = await createPiece(conn, anthology.id, {
    ...accepted,
    title: `Kelp ${tag}`,
    inks: ["teal"],
  });
  // Saddle stitch, 16 pages: sheet 1's inside carries pages 2 and 15, so black and teal share a side.
  for (let page = 1; page <= 16; page++) {
    const pieceId = page === 2 ? drift : page === 15 ? kelp : null;
    await conn.query(
      "INSERT INTO page_slot (anthology_id, page_number, reservation, piece_id, piece_page_index, locked) VALUES (?, ?, ?, ?, ?, 0)",
      [anthology.id, page, page === 1 || page === 16 ? "cover" : null, pieceId, pieceId ? 1 : null],
    );
  }
});

test.afterAll(async () => {
  if (anthology) await conn.query("DELETE FROM anthology WHERE id = ?", [anthology.id]);
  if (artist) await conn.query("DELETE FROM user WHERE id = ?", [artist.id]);
  await conn?.end();
});

test("a spec change that breaks the map is refused; one that costs passes is confirmed, then saved", async ({
  page,
}) => {
  const lead = demoAccount("odile");
  await signInWithPassword(page, lead.email, lead.password, `/studio/${anthology.slug}`);
  await page.getByRole("link", { name: "Print spec" }).click();
  await expect(page.getByRole("heading", { name: "Print spec" })).toBeVisible();
  await expect(page.getByTestId("spec-now")).toContainText("A6");
  await expect(page.locator("#inksPerPass")).toHaveValue("2");

  // Taking teal off the press: a placed piece prints in it.
  await page.getByRole("button", { name: "Remove ink 2" }).click();
  await page.getByTestId("spec-save").click();
  await expect(page.getByTestId("spec-impacts-refusal")).toContainText(
    `“Kelp ${tag}” (page 15) prints in teal`,
  );
  await expect(page.getByTestId("spec-confirm")).toHaveCount(0);

  // One ink a pass: sheet 1's inside, black and teal, now goes through the press twice.
  await page.reload();
  await page.locator("#inksPerPass").fill("1");
  await page.getByTestId("spec-save").click();
  const warning = page.getByTestId("spec-impacts-warning");
  await expect(warning).toContainText("goes through the press 2 times");
  await page.getByTestId("spec-confirm").click();
  await expect(page.getByTestId("spec-saved-summary")).toContainText("The spec is saved");
  await expect(page.getByTestId("spec-saved-summary")).toContainText(
    "Nothing the file check reads changed",
  );
  const [rows] = await conn.query<mysql.RowDataPacket[]>(
    "SELECT inks_per_pass, inks FROM anthology WHERE id = ?",
    [anthology.id],
  );
  expect(rows[0]?.inks_per_pass).toBe(1);
  const inks: unknown = rows[0]?.inks;
  expect(typeof inks === "string" ? JSON.parse(inks) : inks).toEqual(["black", "teal"]);
});
