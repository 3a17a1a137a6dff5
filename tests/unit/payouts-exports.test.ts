import Papa from "papaparse";
import { PDFDocument } from "pdf-lib";
import { describe, expect, it } from "vitest";
import { payoutStatementMail } from "@/lib/mail/templates/payout-statement";
import { centsToDecimal, ledgerCsv, LEDGER_COLUMNS, salesCsv } from "@/lib/payouts-csv";
import { statementLines, statementPdf, type StatementData } from "@/lib/statements";
import type { PersonLedger, SaleWire } from "@/lib/wire/payouts";

const person: PersonLedger = {
  contributorId: "u1",
  label: 'Ada "Salt" Quill, =tide',
  pieces: 1,
  pages: 3,
  account: "ready",
  owedCents: 3470,
  paidCents: 2500,
  outstandingCents: 970,
  lines: [
    {
      id: 1,
      kind: "owed",
      source: "fee",
      amountCents: 2500,
      currency: "USD",
      periodLabel: "Autumn 2026",
      settlesEntryId: null,
      reversesEntryId: null,
      reference: null,
      working: ["Flat fee of $25.00 per piece × 1 piece = $25.00"],
      createdAt: "2026-12-01T10:00:00.000Z",
      status: "paid",
    },
    {
      id: 2,
      kind: "owed",
      source: "share",
      amountCents: 970,
      currency: "USD",
      periodLabel: "Autumn 2026",
      settlesEntryId: null,
      reversesEntryId: null,
      reference: null,
      working: ["Your part: 3 pages of 7 → $9.70 rounded down", "= $9.70"],
      createdAt: "2026-12-01T10:00:00.000Z",
      status: "open",
    },
    {
      id: 3,
      kind: "paid",
      source: "by-hand",
      amountCents: -2500,
      currency: "USD",
      periodLabel: "Autumn 2026",
      settlesEntryId: 1,
      reversesEntryId: null,
      reference: "cash, receipt 14\nsecond line",
      working: [],
      createdAt: "2026-12-01T11:00:00.000Z",
      status: null,
    },
  ],
};

describe("CSV exports", () => {
  it("writes cents as exact decimals", () => {
    expect([0, 5, -50, 1234, -100_001].map(centsToDecimal)).toEqual([
      "0.00",
      "0.05",
      "-0.50",
      "12.34",
      "-1000.01",
    ]);
  });

  it("round-trips the ledger through papaparse: quotes, commas, line breaks and formula-like cells", () => {
    const parsed = Papa.parse<Record<string, string>>(ledgerCsv([person]), {
      header: true,
      skipEmptyLines: true,
    });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual([...LEDGER_COLUMNS]);
    expect(parsed.data.map((r) => r.amount)).toEqual(["25.00", "9.70", "-25.00"]);
    expect(parsed.data[0]!.contributor).toBe('Ada "Salt" Quill, =tide');
    expect(parsed.data[2]!.reference).toBe("cash, receipt 14\nsecond line");
    expect(parsed.data[1]!.working).toBe("Your part: 3 pages of 7 → $9.70 rounded down | = $9.70");
    const total = parsed.data.reduce((sum, r) => sum + Math.round(Number(r.amount) * 100), 0);
    expect(total).toBe(person.outstandingCents);
  });

  it("keeps a cell a spreadsheet would run as a formula as text", () => {
    const sale: SaleWire = {
      id: 1,
      channel: "event",
      label: '=HYPERLINK("x")',
      soldOn: "2026-10-03",
      copies: 2,
      unitPriceCents: 1000,
      discountCents: 0,
      channelFeesCents: 0,
      recoverableCostsCents: 0,
      grossCents: 2000,
      netCents: 2000,
      note: "@note",
    };
    const [row] = Papa.parse<Record<string, string>>(salesCsv([sale], "USD"), {
      header: true,
      skipEmptyLines: true,
    }).data;
    expect(row!.where).toBe('\'=HYPERLINK("x")');
    expect(row!.note).toBe("'@note");
    expect(row!.net).toBe("20.00");
  });
});

describe("statements", () => {
  const statement: StatementData = {
    anthologyTitle: "Low Tide Almanac",
    pressName: "Marrowbend Print Collective",
    periodLabel: "Autumn 2026",
    startsOn: "2026-09-01",
    endsOn: "2026-11-30",
    currency: "USD",
    person: "Ada Quill",
    creditLines: ["Ada Quill"],
    pieces: [{ title: "Salt Ledger", pages: 3 }],
    copiesGiven: 2,
    lines: person.lines.map((l) => ({
      id: l.id,
      kind: l.kind,
      source: l.source,
      amountCents: l.amountCents,
      working: l.working,
      reference: l.reference,
    })),
    owedCents: 3470,
    paidCents: 2500,
    outstandingCents: 970,
  };

  it("lists the credit, work, copies, the period's lines with their working, paid and outstanding", () => {
    const text = statementLines(statement)
      .flatMap((s) => [s.heading, ...s.rows])
      .join("\n");
    expect(text).toContain("Credited as: Ada Quill");
    expect(text).toContain("1 piece, 3 pages");
    expect(text).toContain("Contributor copies given: 2");
    expect(text).toContain("Share of net sales: $9.70");
    expect(text).toContain("Paid: $25.00");
    expect(text).toContain("Still to pay: $9.70");
    expect(text).toContain("not tax");
  });

  it("makes a PDF with its title and the same figures in the e-mail", async () => {
    const pdf = await PDFDocument.load(
      await statementPdf({ ...statement, person: "Zoë Ørsted 山田" }),
    );
    expect(pdf.getPageCount()).toBe(1);
    expect(pdf.getTitle()).toBe("Low Tide Almanac: statement for Zoë Ørsted 山田, Autumn 2026");
    const mail = payoutStatementMail({ statement, greeting: "Ada", link: "http://localhost/x" });
    expect(mail.subject).toBe("Low Tide Almanac: your statement for Autumn 2026");
    expect(mail.text).toContain("Still to pay to you: $9.70");
    expect(mail.text).toContain("    Your part: 3 pages of 7");
    expect(mail.html).not.toContain("<script");
  });
});
