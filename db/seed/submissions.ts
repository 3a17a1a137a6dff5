/**
 * Demo submissions to the Low Tide Almanac's open call: invented artwork drawn with sharp, stored
 * through the upload service (the local fake must be running) and put through the same spec-check
 * pipeline as a browser upload. Some files pass, some have findings (no bleed, low resolution,
 * colour for the duplicator); one page has two versions; the pieces sit in several statuses, and the
 * accepted ones fill the demo page map. Accepted pieces in two inks are sent as one greyscale
 * master per ink (lib/pieces/separations.ts), so the demo run has masters to make.
 * Idempotent: a piece is matched by its contributor and title and never seeded twice.
 */
import { and, eq } from "drizzle-orm";
import sharp from "sharp";
import type { Db } from "@/db";
import { schema } from "@/db";
import { createPiece, findCall } from "@/db/queries/submissions";
import type { PieceKind, PieceStatus } from "@/lib/domain";
import { ingestUpload } from "@/server/submissions/ingest";
import { storeFile } from "@/server/uploads";

type Art = {
  name: string;
  width: number;
  height: number;
  colour: boolean;
  svg: (w: number, h: number) => string;
  /** The ink this file is the master for (a separation); absent for a page's composite file. */
  ink?: string;
};

type DemoPiece = {
  email: string;
  title: string;
  kind: PieceKind;
  inks: string[];
  creditLine: string;
  statement: string;
  altTexts: string[];
  /** Files per page, oldest first; a page with no files stays missing. */
  pages: Art[][];
  status?: { to: PieceStatus; by: string; message: string };
};

// Half letter with 1/8 in bleed at 300 ppi is 1725 x 2625 px; without bleed 1650 x 2550 px (pixels = inches x
// ppi, as in the Haematologica "Image resolution" advisor, submit.haematologica.org/image_analysis/advisor/image_resolution.html).
const FULL = { width: 1725, height: 2625 };
const TRIM_ONLY = { width: 1650, height: 2550 };

const wrackLine = (w: number, h: number) => `
  <rect width="${w}" height="${h}" fill="#d8d8d8"/>
  <path d="M0 ${h * 0.62} C ${w * 0.25} ${h * 0.55}, ${w * 0.5} ${h * 0.7}, ${w} ${h * 0.6} L ${w} ${h} L 0 ${h} Z" fill="#555"/>
  ${Array.from({ length: 14 }, (_, i) => `<circle cx="${(w * (i + 0.5)) / 14}" cy="${h * (0.6 + 0.03 * Math.sin(i))}" r="${18 + (i % 4) * 9}" fill="#222"/>`).join("")}
  <text x="${w / 2}" y="${h * 0.3}" font-family="serif" font-size="${w / 12}" text-anchor="middle" fill="#111">Wrack Line</text>`;

const mudflat = (w: number, h: number) => `
  <rect width="${w}" height="${h}" fill="#8fb8b0"/>
  ${Array.from({ length: 9 }, (_, i) => `<ellipse cx="${w * 0.5 + Math.sin(i) * w * 0.3}" cy="${(h * (i + 1)) / 10}" rx="${w * 0.04}" ry="${h * 0.015}" fill="#2a4f4a"/>`).join("")}
  <text x="${w / 2}" y="${h * 0.08}" font-family="sans-serif" font-size="${w / 14}" text-anchor="middle" fill="#c8553d">Tracks</text>`;

const glassShore = (w: number, h: number) => `
  <rect width="${w}" height="${h}" fill="#f0f0f0"/>
  ${Array.from({ length: 30 }, (_, i) => `<polygon points="${(i * 53) % w},${(i * 97) % h} ${((i * 53) % w) + 60},${((i * 97) % h) + 20} ${((i * 53) % w) + 25},${((i * 97) % h) + 70}" fill="#444"/>`).join("")}
  <text x="${w * 0.03}" y="${h / 2}" font-family="serif" font-size="${w / 16}" fill="#000">shore</text>`;

const bottle = (w: number, h: number) => `
  <rect width="${w}" height="${h}" fill="#ffffff"/>
  <rect x="${w * 0.4}" y="${h * 0.25}" width="${w * 0.2}" height="${h * 0.45}" rx="${w * 0.05}" fill="#333"/>
  <rect x="${w * 0.46}" y="${h * 0.17}" width="${w * 0.08}" height="${h * 0.1}" fill="#333"/>`;

const art = (
  name: string,
  size: { width: number; height: number },
  svg: Art["svg"],
  colour = false,
): Art => ({ name, ...size, colour, svg });

/** A simple greyscale study for the accepted demo pieces: bands of "water", scattered finds and a label. */
const study = (label: string, variant: number) => (w: number, h: number) => `
  <rect width="${w}" height="${h}" fill="#f4f4f4"/>
  ${Array.from({ length: 6 }, (_, i) => `<path d="M0 ${h * (0.35 + i * 0.1)} Q ${w / 2} ${h * (0.3 + i * 0.1 + (variant % 3) * 0.02)}, ${w} ${h * (0.36 + i * 0.1)}" stroke="#333" stroke-width="${10 + ((i + variant) % 3) * 6}" fill="none"/>`).join("")}
  ${Array.from({ length: 8 + variant }, (_, i) => `<circle cx="${(w * ((i * 37 + variant * 11) % 100)) / 100}" cy="${h * (0.2 + ((i * 13) % 10) / 60)}" r="${14 + (i % 5) * 8}" fill="#111"/>`).join("")}
  <text x="${w / 2}" y="${h * 0.14}" font-family="serif" font-size="${w / 13}" text-anchor="middle" fill="#111">${label}</text>`;

const ACCEPTED_BY = { to: "accepted" as const, by: "odile@marrowbend.test" };

/** Accepted pieces for the demo page map, every page a passing greyscale file. */
const ACCEPTED: DemoPiece[] = [
  [
    "tomasz",
    "Tomasz Vireo",
    "Bladderwrack Census",
    "spread",
    ["black", "teal"],
    2,
    "Counted along one metre of rope.",
  ],
  [
    "bea",
    "Bea Okonkwo-Hale",
    "The Limpet Clock",
    "single",
    ["black"],
    1,
    "Limpets keep their own time.",
  ],
  ["imke", "Imke Sallow", "Mudflat at Six", "single", ["teal"], 1, "Low water on a still evening."],
  [
    "bea",
    "Bea Okonkwo-Hale",
    "Hermit Crab Moving Day",
    "run",
    ["black"],
    3,
    "A three-page comic about a crab trading up.",
  ],
  [
    "tomasz",
    "Tomasz Vireo",
    "Low Water Mark",
    "single",
    ["teal"],
    1,
    "The line the sea draws twice a day.",
  ],
  [
    "imke",
    "Imke Sallow",
    "Sea Glass Inventory",
    "single",
    ["black", "teal"],
    1,
    "Every piece from one morning's walk.",
  ],
  [
    "tomasz",
    "Tomasz Vireo",
    "What the Heron Kept",
    "single",
    ["black"],
    1,
    "A heron's larder, drawn from a hide.",
  ],
  [
    "bea",
    "Bea Okonkwo-Hale",
    "Tide Table for Insomniacs",
    "spread",
    ["teal"],
    2,
    "High and low water for people awake at 3 a.m.",
  ],
].map(([who, name, title, kind, inks, pages, statement], n) => ({
  email: `${who}@lanternfield.test`,
  title: title as string,
  kind: kind as PieceKind,
  inks: inks as string[],
  creditLine: name as string,
  statement: statement as string,
  altTexts: [],
  pages: Array.from({ length: pages as number }, (_, p) => {
    const base = `${String(title)
      .toLowerCase()
      .replace(/[^a-z]+/g, "-")}-${p + 1}`;
    const label = String(title).split(" ")[0] ?? "";
    const list = inks as string[];
    if (list.length < 2) return [art(`${base}.png`, FULL, study(label, n + p))];
    // One master per ink: each ink draws its own share of the study (a different variant).
    return list.map((ink, k) => ({
      ...art(`${base}-${ink}.png`, FULL, study(`${label} ${ink}`, n + p + k * 5)),
      ink,
    }));
  }),
  status: { ...ACCEPTED_BY, message: "Accepted: it is going in the almanac." },
}));

const DEMO: DemoPiece[] = [
  {
    email: "bea@lanternfield.test",
    title: "Wrack Line Inventory",
    kind: "single",
    inks: ["black"],
    creditLine: "Drawn by Bea Okonkwo-Hale",
    statement:
      "Everything I picked up along one hundred steps of the wrack line on a Sunday in March.",
    altTexts: [
      "A band of dark seaweed crosses the page, studded with round pebbles, under the words Wrack Line.",
    ],
    pages: [
      [art("wrack-line-v1.png", TRIM_ONLY, wrackLine), art("wrack-line-v2.png", FULL, wrackLine)],
    ],
  },
  {
    email: "tomasz@lanternfield.test",
    title: "Mudflat Tracks",
    kind: "spread",
    inks: ["black", "teal"],
    creditLine: "Tomasz Vireo",
    statement:
      "Bird tracks at low water, left page in colour as a guide, right page scanned from my sketchbook.",
    altTexts: [],
    pages: [
      [art("tracks-left.png", FULL, mudflat, true)],
      [art("tracks-right.png", { width: 863, height: 1313 }, mudflat)],
    ],
    status: {
      to: "fix-requested",
      by: "odile@marrowbend.test",
      message:
        "Lovely tracks! The left page needs separating into a black file and a teal file, and the right page needs a 300 ppi scan.",
    },
  },
  {
    email: "imke@lanternfield.test",
    title: "The Glass Shore",
    kind: "single",
    inks: ["teal"],
    creditLine: "Imke Sallow",
    statement: "Sea glass, sorted by how frosted it is.",
    altTexts: [
      "Scattered triangular shards of glass with the word shore written close to the left edge.",
    ],
    pages: [[art("glass-shore.png", FULL, glassShore)]],
    status: {
      to: "shortlisted",
      by: "odile@marrowbend.test",
      message: "Shortlisted for the centre spread.",
    },
  },
  {
    email: "imke@lanternfield.test",
    title: "Bottle Post",
    kind: "run",
    inks: ["black"],
    creditLine: "Imke Sallow",
    statement: "A three-page story about a message that never arrives.",
    altTexts: [],
    pages: [[art("bottle-1.png", FULL, bottle)], [art("bottle-2.png", FULL, bottle)], []],
  },
  ...ACCEPTED,
];

async function render(a: Art): Promise<Buffer> {
  const svg = Buffer.from(
    `<svg xmlns="http://www.w3.org/2000/svg" width="${a.width}" height="${a.height}">${a.svg(a.width, a.height)}</svg>`,
  );
  const image = sharp(svg).flatten({ background: "#ffffff" });
  const shaped = a.colour ? image.toColourspace("srgb") : image.toColourspace("b-w");
  // withDensity writes 300 ppi without carrying an sRGB profile over (which would turn grey back into RGB).
  return shaped.withDensity(300).png({ compressionLevel: 9 }).toBuffer();
}

/** Seeds the demo pieces; returns how many were added, or null when the upload service is not running. */
export async function seedSubmissions(db: Db): Promise<number | null> {
  const [almanac] = await db
    .select()
    .from(schema.anthologies)
    .where(eq(schema.anthologies.slug, "low-tide-almanac"))
    .limit(1);
  if (!almanac) throw new Error("seed the demo press before its submissions");
  const call = await findCall(almanac.id);
  if (!call) throw new Error("seed the open call before its submissions");
  const people = await db
    .select({ id: schema.users.id, email: schema.users.email })
    .from(schema.users);
  const idOf = (email: string) => {
    const person = people.find((p) => p.email === email);
    if (!person) throw new Error(`demo person ${email} missing`);
    return person.id;
  };

  let added = 0;
  for (const demo of DEMO) {
    const userId = idOf(demo.email);
    const [exists] = await db
      .select({ id: schema.pieces.id })
      .from(schema.pieces)
      .where(
        and(
          eq(schema.pieces.anthologyId, almanac.id),
          eq(schema.pieces.contributorId, userId),
          eq(schema.pieces.title, demo.title),
        ),
      )
      .limit(1);
    if (exists) continue;

    // Store every file first: a piece is only created once its files are safely stored.
    const stored: {
      bytes: Buffer;
      ink: string | null;
      file: Awaited<ReturnType<typeof storeFile>>;
    }[][] = [];
    try {
      for (const files of demo.pages) {
        const page = [];
        for (const a of files) {
          const bytes = await render(a);
          page.push({
            bytes,
            ink: a.ink ?? null,
            file: await storeFile(bytes, a.name, "image/png"),
          });
        }
        stored.push(page);
      }
    } catch (error) {
      console.warn(
        `demo submissions skipped: the upload service did not take the demo files (${error instanceof Error ? error.message : String(error)}). ` +
          "Start the fakes (node storage-fake/start.mjs) before seeding to get them.",
      );
      return null;
    }

    const piece = await createPiece(almanac, call, userId, {
      title: demo.title,
      kind: demo.kind,
      pageCount: demo.pages.length,
      inks: demo.inks,
      creditLine: demo.creditLine,
      statement: demo.statement,
      altTexts: demo.altTexts,
    });
    for (const [i, files] of stored.entries()) {
      for (const { bytes, ink, file } of files) {
        await ingestUpload(
          {
            pieceId: piece.id,
            pageIndex: i + 1,
            ink,
            expectedRevision: null,
            uploadedBy: userId,
            file,
          },
          { bytes, notify: false, enforceWindow: false },
        );
      }
    }
    if (demo.status) {
      await db
        .update(schema.pieces)
        .set({ status: demo.status.to })
        .where(eq(schema.pieces.id, piece.id));
      await db.insert(schema.pieceEvents).values({
        pieceId: piece.id,
        actorId: idOf(demo.status.by),
        fromStatus: "awaiting-review",
        toStatus: demo.status.to,
        message: demo.status.message,
      });
    }
    added++;
  }
  return added;
}
