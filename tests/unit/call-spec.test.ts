import { describe, expect, it } from "vitest";
import { callSpecSummary, colourModeText } from "@/lib/call-spec";
import { copiesText, feeText, salesShareText } from "@/lib/call-terms";
import { specOf } from "@/lib/print/spec";
import { inToMm } from "@/lib/print/units";

// The anthology's spec columns as the database stores them (an anthology row has more).
const almanacRow = {
  id: 7,
  title: "Low Tide Almanac",
  trimPreset: "half-letter",
  trimWidthMm: inToMm(5.5),
  trimHeightMm: inToMm(8.5),
  bleedMm: inToMm(0.125),
  safeMarginMm: inToMm(0.25),
  minPpi: 300,
  printMethod: "duplicator" as const,
  inks: ["black", "teal"],
  inksPerPass: 1,
};
const almanac = specOf(almanacRow);

describe("the spec summary of a call", () => {
  it("gives half letter + 0.125 in bleed as 5.75 x 8.75 in and 1725 x 2625 px at 300 ppi (trim + 2 x bleed; pixels = inches x ppi, Haematologica 'Image resolution' advisor)", () => {
    const summary = callSpecSummary(almanac);
    const row = (key: string) => summary.rows.find((r) => r.key === key)?.value;
    expect(summary.pixels).toEqual({ widthPx: 1725, heightPx: 2625, ppi: 300 });
    expect(row("with-bleed")).toBe("5.75 x 8.75 in (146.05 x 222.25 mm)");
    expect(row("trim")).toBe("Half letter (5.5 x 8.5 in), 139.7 x 215.9 mm");
    expect(row("pixels")).toBe("1725 x 2625 px (page with bleed at 300 ppi)");
    expect(row("colour")).toBe(
      "One greyscale file per ink (black, teal), dark where that ink prints",
    );
    // Every format the spec check measures, named as the checker names them.
    expect(row("files")).toBe("PNG, JPEG, TIFF, WebP or PDF, one file per page");
  });

  it("gives A5 + 3 mm as 154 x 216 mm (ISO 216 A5 = 148 x 210 mm, plus 3 mm each side) and rounds pixels up", () => {
    const summary = callSpecSummary(
      specOf({
        ...almanacRow,
        trimPreset: "a5",
        trimWidthMm: 148,
        trimHeightMm: 210,
        bleedMm: 3,
        printMethod: "laser-black",
        inks: ["black"],
      }),
    );
    expect(summary.rows.find((r) => r.key === "with-bleed")?.value).toBe(
      "154 x 216 mm (6.063 x 8.504 in)",
    );
    expect(summary.pixels).toMatchObject({ widthPx: 1819, heightPx: 2552 });
  });

  it("names the colour mode each print method takes", () => {
    expect(colourModeText("duplicator", ["black"])).toBe(
      "Greyscale, dark where the black ink prints",
    );
    // The call narrows the inks: its allowed inks replace the anthology's.
    expect(callSpecSummary(specOf(almanacRow, { inks: ["teal"] })).colourMode).toBe(
      "Greyscale, dark where the teal ink prints",
    );
    expect(colourModeText("laser-black", [])).toMatch(/^Greyscale/);
    expect(colourModeText("inkjet", [])).toMatch(/^RGB/);
  });
});

describe("terms in words", () => {
  it("spells out fees, shares and copies", () => {
    expect(feeText({ feeKind: "per-piece", feeCents: 2500 }, "USD")).toBe("$25.00 per piece");
    expect(feeText({ feeKind: "per-page", feeCents: 800 }, "EUR")).toBe("€8.00 per page");
    expect(feeText({ feeKind: "none", feeCents: 0 }, "USD")).toBe("No fee");
    expect(salesShareText(1000)).toBe("10 % of net sales, shared among the contributors");
    expect(salesShareText(0)).toBe("No share of sales");
    expect(copiesText(2)).toBe("2 copies of the printed book");
    expect(copiesText(1)).toBe("1 copy of the printed book");
  });
});
