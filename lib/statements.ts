/**
 * A contributor's statement for one period: what they have in the book, the copies given, each
 * line of the period with its working, and what has been paid and is still owed. Pure: the same
 * data makes the e-mail's lines and the PDF (pdf-lib, given no bytes from outside).
 */
import { PDFDocument, StandardFonts, rgb, type PDFFont } from "pdf-lib";
import { LEDGER_KIND_LABELS, type LedgerKind, type LedgerSource } from "@/lib/domain";
import { formatCents } from "@/lib/money";
import { RECORDS_NOTE } from "@/lib/payouts";

export type StatementData = {
  anthologyTitle: string;
  pressName: string | null;
  periodLabel: string;
  /** YYYY-MM-DD. */
  startsOn: string;
  endsOn: string;
  currency: string;
  person: string;
  creditLines: string[];
  pieces: { title: string; pages: number }[];
  copiesGiven: number | null;
  lines: {
    id: number;
    kind: LedgerKind;
    source: LedgerSource;
    amountCents: number;
    working: string[];
    reference: string | null;
  }[];
  /** Over every period to date. */
  owedCents: number;
  paidCents: number;
  outstandingCents: number;
};

const SOURCE_WORDS: Record<LedgerSource, string> = {
  fee: "Flat fee",
  share: "Share of net sales",
  transfer: "Transfer",
  "by-hand": "Paid by hand",
  correction: "Correction",
};

/** The statement as plain lines: the e-mail body and the PDF both read these. */
export function statementLines(s: StatementData): { heading: string; rows: string[] }[] {
  const money = (c: number) => formatCents(c, s.currency);
  const pages = s.pieces.reduce((a, p) => a + p.pages, 0);
  return [
    {
      heading: "In the book",
      rows: [
        `Credited as: ${s.creditLines.join("; ") || "(no credit line yet)"}`,
        `${s.pieces.length} ${s.pieces.length === 1 ? "piece" : "pieces"}, ${pages} ${pages === 1 ? "page" : "pages"}: ${s.pieces.map((p) => `“${p.title}” (${p.pages} p.)`).join(", ")}`,
        s.copiesGiven === null
          ? "Contributor copies: not handed over yet"
          : `Contributor copies given: ${s.copiesGiven}`,
      ],
    },
    {
      heading: `This period (${s.periodLabel}, ${s.startsOn} to ${s.endsOn})`,
      rows:
        s.lines.length === 0
          ? ["Nothing was owed or paid in this period."]
          : s.lines.flatMap((l) => [
              `${LEDGER_KIND_LABELS[l.kind]} · ${SOURCE_WORDS[l.source]}: ${money(l.kind === "scheduled" ? 0 : Math.abs(l.amountCents))}${l.reference ? ` (${l.reference})` : ""}`,
              ...l.working.map((w) => `    ${w}`),
            ]),
    },
    {
      heading: "To date",
      rows: [
        `Owed: ${money(s.owedCents)}`,
        `Paid: ${money(s.paidCents)}`,
        `Still to pay: ${money(s.outstandingCents)}`,
      ],
    },
    { heading: "Note", rows: [RECORDS_NOTE] },
  ];
}

/** Replaces what the standard PDF fonts cannot draw (WinAnsi) so a name never breaks the file. */
function drawable(font: PDFFont, text: string): string {
  const swapped = text.replace(/→/g, "->").replace(/\u00a0|\u202f/g, " ");
  let out = "";
  for (const ch of swapped) {
    try {
      font.encodeText(ch);
      out += ch;
    } catch {
      out += "?";
    }
  }
  return out;
}

function wrap(font: PDFFont, text: string, size: number, width: number): string[] {
  const words = text.split(/(\s+)/);
  const lines: string[] = [];
  let line = "";
  for (const w of words) {
    const next = line + w;
    if (line.trim() !== "" && font.widthOfTextAtSize(next, size) > width) {
      lines.push(line.trimEnd());
      line = w.trimStart();
    } else line = next;
  }
  if (line.trim() !== "") lines.push(line.trimEnd());
  return lines;
}

/** The statement as a PDF on A4 (ISO 216: 210 × 297 mm = 595.28 × 841.89 pt). */
export async function statementPdf(s: StatementData): Promise<Uint8Array> {
  const doc = await PDFDocument.create();
  doc.setTitle(`${s.anthologyTitle}: statement for ${s.person}, ${s.periodLabel}`);
  doc.setAuthor(s.pressName ?? s.anthologyTitle);
  doc.setCreator("Quireline");
  doc.setSubject("Contributor statement");
  const regular = await doc.embedFont(StandardFonts.Helvetica);
  const bold = await doc.embedFont(StandardFonts.HelveticaBold);
  const [pageW, pageH] = [595.28, 841.89];
  const margin = 56;
  let page = doc.addPage([pageW, pageH]);
  let y = pageH - margin;
  const ink = rgb(0.11, 0.106, 0.086);
  const put = (text: string, font: PDFFont, size: number, indent = 0) => {
    for (const line of wrap(font, drawable(font, text), size, pageW - 2 * margin - indent)) {
      if (y < margin + size) {
        page = doc.addPage([pageW, pageH]);
        y = pageH - margin;
      }
      page.drawText(line, { x: margin + indent, y: y - size, size, font, color: ink });
      y -= size * 1.4;
    }
  };
  put(s.anthologyTitle, bold, 18);
  put(`Statement for ${s.person} · ${s.periodLabel}`, regular, 12);
  y -= 8;
  for (const section of statementLines(s)) {
    y -= 6;
    put(section.heading, bold, 12);
    for (const row of section.rows) {
      const indented = row.startsWith("    ");
      put(row.trim(), regular, indented ? 9 : 10, indented ? 14 : 0);
    }
  }
  return doc.save();
}
