import { describe, expect, it } from "vitest";
import { checkArtwork, type Finding, type SpecReport } from "@/lib/print/check";
import type { PrintSpec } from "@/lib/print/spec";
import {
  readable,
  shouldBecomeCurrent,
  unreadableSinceCurrent,
  UNREADABLE_CODES,
} from "@/lib/pieces/versions";
import { encryptedPdf, makePdf, makePng } from "./print/fixtures";

// ISO 216: A5 = 148 x 210 mm; 3 mm bleed, 5 mm safe margin (common practice, no source).
const spec: PrintSpec = {
  trimWidthMm: 148,
  trimHeightMm: 210,
  bleedMm: 3,
  safeMarginMm: 5,
  minPpi: 100,
  printMethod: "laser-black",
  inks: [],
  pagesExpected: 1,
};
// A5 + 3 mm bleed is 154 x 216 mm = 6.063 x 8.504 in: 607 x 851 px at 100 ppi, rounded up.
const page = () => makePng(607, 851, () => [90, 90, 90, 255]);
const check = (bytes: Uint8Array, filename: string) => checkArtwork(bytes, spec, { filename });

function report(...findings: Pick<Finding, "code" | "severity">[]): SpecReport {
  return {
    format: "png",
    measured: { byteLength: 1 },
    findings: findings.map((f) => ({ ...f, message: f.code })),
    verdict: findings.length ? "blocker" : "pass",
  };
}

describe("whether the check could read a file, from its own report", () => {
  it("a whole page is readable, and so is a file that fails the spec on its measurements", async () => {
    const good = await check(page(), "page.png");
    expect(good.verdict).not.toBe("blocker");
    expect(readable(good)).toBe(true);
    // A quarter-turned page is read and measured; it fails, but it is not unreadable.
    const sideways = await check(
      makePng(851, 607, () => [90, 90, 90, 255]),
      "sideways.png",
    );
    expect(sideways.findings.map((f) => f.code)).toContain("wrong-orientation");
    expect(readable(sideways)).toBe(true);
  });

  const unreadable: [string, () => Promise<Uint8Array> | Uint8Array, string, string][] = [
    ["an empty file", () => new Uint8Array(0), "empty.png", "file-empty"],
    // PNG (ISO/IEC 15948) ends with an IEND chunk; 2000 bytes of this one stop well before it.
    ["a cut-short PNG", () => page().subarray(0, 2000), "cut.png", "file-truncated"],
    ["an encrypted PDF", () => encryptedPdf(), "locked.pdf", "pdf-encrypted"],
    [
      "text named .png",
      () => new TextEncoder().encode("notes, not a picture\n".repeat(10)),
      "notes.png",
      "file-unrecognised",
    ],
    [
      "a GIF",
      () => Buffer.from("GIF89a\x01\x00\x01\x00\x00\x00\x00;", "latin1"),
      "a.gif",
      "file-unsupported",
    ],
  ];
  for (const [label, make, name, code] of unreadable)
    it(`${label} is unreadable (${code})`, async () => {
      const r = await check(await make(), name);
      expect(r.findings.map((f) => f.code)).toContain(code);
      expect(UNREADABLE_CODES.has(code)).toBe(true);
      expect(readable(r)).toBe(false);
    });

  it("a two-page PDF is read (it has the wrong page count, which is a measurement)", async () => {
    // A5 + 3 mm bleed = 154 x 216 mm = 436.5 x 612.3 pt (72 pt per inch).
    const r = await check(
      await makePdf([{ media: [436.5, 612.3] }, { media: [436.5, 612.3] }]),
      "two.pdf",
    );
    expect(r.findings.map((f) => f.code)).toContain("pdf-page-count");
    expect(readable(r)).toBe(true);
  });
});

describe("which upload becomes the page's current file", () => {
  const passing = report();
  const noBleed = report({ code: "no-bleed", severity: "warning" });
  const wrongShape = report({ code: "wrong-aspect", severity: "blocker" });
  const truncated = report({ code: "file-truncated", severity: "blocker" });
  const encrypted = report({ code: "pdf-encrypted", severity: "blocker" });

  it("a readable file always takes the page, even one that fails the spec", () => {
    expect(shouldBecomeCurrent(passing, null)).toBe(true);
    expect(shouldBecomeCurrent(noBleed, passing)).toBe(true);
    expect(shouldBecomeCurrent(wrongShape, passing)).toBe(true);
    expect(shouldBecomeCurrent(passing, truncated)).toBe(true);
  });

  it("an unreadable file never displaces a readable one, passing or not", () => {
    expect(shouldBecomeCurrent(truncated, passing)).toBe(false);
    expect(shouldBecomeCurrent(encrypted, noBleed)).toBe(false);
    expect(shouldBecomeCurrent(truncated, wrongShape)).toBe(false);
  });

  it("an unreadable file is shown when there is nothing readable to keep", () => {
    expect(shouldBecomeCurrent(truncated, null)).toBe(true);
    expect(shouldBecomeCurrent(encrypted, truncated)).toBe(true);
  });
});

describe("unreadable uploads since the current file", () => {
  const v = (id: number, versionNumber: number, r: SpecReport) => ({
    id,
    versionNumber,
    report: r,
  });
  const passing = report();
  const truncated = report({ code: "file-truncated", severity: "blocker" });
  const empty = report({ code: "file-empty", severity: "blocker" });

  it("lists the newer unreadable uploads, newest first, and not older ones", () => {
    const versions = [v(1, 1, empty), v(2, 2, passing), v(3, 3, truncated), v(4, 4, empty)];
    expect(unreadableSinceCurrent(versions, 2).map((x) => x.versionNumber)).toEqual([4, 3]);
  });

  it("lists nothing when the current file is itself unreadable, or there is none", () => {
    expect(unreadableSinceCurrent([v(1, 1, truncated), v(2, 2, empty)], 2)).toEqual([]);
    expect(unreadableSinceCurrent([v(1, 1, truncated)], null)).toEqual([]);
  });
});
