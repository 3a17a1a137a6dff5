/**
 * The demo comics jam laid out and ready for print files: eight A6 pages, Imke's cover on page
 * 1, her four-page comic on pages 3–6 and a last panel on page 8, the inside covers kept blank,
 * every page a passing greyscale file checked by the upload pipeline. Bea (the jam's lead) can
 * produce its print files straight away; one credit line is still waiting for approval, so the
 * preflight shows a warning that does not block. Needs the upload fake running.
 * Idempotent: once the jam has any page slots or pieces it is left as it is.
 */
import { eq } from "drizzle-orm";
import sharp from "sharp";
import type { Db } from "@/db";
import { schema } from "@/db";
import type { PieceKind } from "@/lib/domain";
import { ingestUpload } from "@/server/submissions/ingest";
import { storeFile } from "@/server/uploads";

// ISO 216: A6 = 105 x 148 mm; with 3 mm bleed 111 x 154 mm, at 300 ppi 1311 x 1819 px
// (pixels = mm / 25.4 x ppi, rounded up).
const W = 1311;
const H = 1819;

const panel = (label: string, n: number) => `
<svg xmlns="http://www.w3.org/2000/svg" width="${W}" height="${H}">
  <rect width="${W}" height="${H}" fill="#f6f6f6"/>
  ${Array.from({ length: 4 }, (_, i) => `<rect x="${120 + (i % 2) * 560}" y="${260 + Math.floor(i / 2) * 700}" width="510" height="640" fill="none" stroke="#111" stroke-width="14"/>`).join("")}
  ${Array.from({ length: 5 + n }, (_, i) => `<circle cx="${200 + ((i * 173 + n * 61) % 900)}" cy="${400 + ((i * 251) % 1200)}" r="${30 + (i % 3) * 18}" fill="#222"/>`).join("")}
  <text x="${W / 2}" y="190" font-family="sans-serif" font-size="92" text-anchor="middle" fill="#111">${label}</text>
</svg>`;

type JamPiece = {
  title: string;
  kind: PieceKind;
  pages: string[];
  credit: string;
  approved: boolean;
  at: number;
};

const PIECES: JamPiece[] = [
  {
    title: "Jam Night",
    kind: "single",
    pages: ["Jam Night"],
    credit: "Imke Sallow",
    approved: true,
    at: 1,
  },
  {
    title: "Four Cats, One Window",
    kind: "run",
    pages: ["Cats 1", "Cats 2", "Cats 3", "Cats 4"],
    credit: "Imke Sallow",
    approved: true,
    at: 3,
  },
  {
    title: "Last Bus Home",
    kind: "single",
    pages: ["Last Bus"],
    credit: "Imke Sallow",
    approved: false,
    at: 8,
  },
];

export async function seedPrintReady(db: Db): Promise<{ slug: string; pages: number } | null> {
  const [jam] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.slug, "heron-street-comics-jam"))
    .limit(1);
  if (!jam) throw new Error("seed the demo press before the jam's print-ready map");
  const [slot] = await db
    .select({ id: schema.pageSlots.id })
    .from(schema.pageSlots)
    .where(eq(schema.pageSlots.anthologyId, jam.id))
    .limit(1);
  if (slot) return null;
  // A run cut short after adding the pieces leaves them; the jam is then left as it is too.
  const [already] = await db
    .select({ id: schema.pieces.id })
    .from(schema.pieces)
    .where(eq(schema.pieces.anthologyId, jam.id))
    .limit(1);
  if (already) return null;
  const [imke] = await db
    .select({ id: schema.users.id })
    .from(schema.users)
    .where(eq(schema.users.email, "imke@lanternfield.test"))
    .limit(1);
  if (!imke) throw new Error("demo contributor imke@lanternfield.test missing");

  const placed: { page: number; pieceId: number; index: number }[] = [];
  try {
    for (const [n, demo] of PIECES.entries()) {
      const [inserted] = await db
        .insert(schema.pieces)
        .values({
          anthologyId: jam.id,
          contributorId: imke.id,
          title: demo.title,
          kind: demo.kind,
          pageCount: demo.pages.length,
          inks: ["black"],
          creditLine: demo.credit,
          creditApprovedAt: demo.approved ? new Date() : null,
          status: "accepted",
        })
        .$returningId();
      const pieceId = inserted!.id;
      await db
        .insert(schema.piecePages)
        .values(demo.pages.map((_, i) => ({ pieceId, pageIndex: i + 1 })));
      for (const [i, label] of demo.pages.entries()) {
        const bytes = await sharp(Buffer.from(panel(label, n + i)))
          .toColourspace("b-w")
          .withDensity(300)
          .png()
          .toBuffer();
        const name = `${label.toLowerCase().replace(/[^a-z0-9]+/g, "-")}.png`;
        const file = await storeFile(bytes, name, "image/png");
        await ingestUpload(
          { pieceId, pageIndex: i + 1, expectedRevision: null, uploadedBy: imke.id, file },
          { bytes, notify: false, enforceWindow: false },
        );
        placed.push({ page: demo.at + i, pieceId, index: i + 1 });
      }
      // The upload pipeline may move a piece's status; the jam's pieces are accepted.
      await db
        .update(schema.pieces)
        .set({ status: "accepted" })
        .where(eq(schema.pieces.id, pieceId));
    }
  } catch (error) {
    console.warn(
      `demo print-ready jam skipped: ${error instanceof Error ? error.message : String(error)}`,
    );
    return null;
  }

  const pages = 8;
  await db.transaction(async (tx) => {
    await tx.insert(schema.pageSlots).values(
      Array.from({ length: pages }, (_, i) => {
        const at = placed.find((p) => p.page === i + 1);
        return {
          anthologyId: jam.id,
          pageNumber: i + 1,
          // Page 2 carries the credits and page 7 the colophon, set in type from the approved
          // credit lines when the print files are made; nothing else is left empty.
          reservation: at ? null : i + 1 === 2 ? ("credits" as const) : ("colophon" as const),
          pieceId: at?.pieceId ?? null,
          piecePageIndex: at?.index ?? null,
          locked: false,
        };
      }),
    );
    await tx
      .update(schema.anthologies)
      .set({ pageCountTarget: pages, mapVersion: jam.mapVersion + 1 })
      .where(eq(schema.anthologies.id, jam.id));
  });
  return { slug: jam.slug, pages };
}
