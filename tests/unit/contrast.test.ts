import { describe, expect, it } from "vitest";
import config from "@/tailwind.config";

// WCAG 2.2 SC 1.4.3 (4.5:1) and SC 1.4.11 (3:1); relative luminance per WCAG 2.x definition:
// L = 0.2126 R + 0.7152 G + 0.0722 B, each channel c/255 linearised as c/12.92 when c <= 0.04045,
// else ((c + 0.055) / 1.055) ^ 2.4; contrast ratio = (L_lighter + 0.05) / (L_darker + 0.05).
function channel(value: number): number {
  const c = value / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

function luminance(hex: string): number {
  const n = Number.parseInt(hex.replace("#", ""), 16);
  return 0.2126 * channel(n >> 16) + 0.7152 * channel((n >> 8) & 255) + 0.0722 * channel(n & 255);
}

function contrast(a: string, b: string): number {
  const [light, dark] = [luminance(a), luminance(b)].sort((x, y) => y - x);
  return (light! + 0.05) / (dark! + 0.05);
}

const colors = config.theme.extend.colors;
const WHITE = "#ffffff";
const TEXT = 4.5; // SC 1.4.3, normal-size text
const NON_TEXT = 3; // SC 1.4.11, UI components and focus indicators

describe("the contrast formula", () => {
  it("black on white is 21:1 and a colour on itself is 1:1 (the ends of the WCAG 2.x scale)", () => {
    expect(contrast("#000000", WHITE)).toBeCloseTo(21, 5);
    expect(contrast(colors.paper.DEFAULT, colors.paper.DEFAULT)).toBeCloseTo(1, 5);
  });

  it("#767676 on white is 4.54:1, the lightest grey that passes 4.5:1 on white (from memory)", () => {
    expect(contrast("#767676", WHITE)).toBeCloseTo(4.54, 2);
    expect(contrast("#777777", WHITE)).toBeLessThan(TEXT);
  });
});

describe("Quireline's text pairs reach 4.5:1 (WCAG 2.2 SC 1.4.3)", () => {
  const pairs: [string, string, string][] = [
    ["ink on paper", colors.ink.DEFAULT, colors.paper.DEFAULT],
    ["soft ink on paper", colors.ink.soft, colors.paper.DEFAULT],
    ["soft ink on deep paper", colors.ink.soft, colors.paper.deep],
    ["faint ink on paper", colors.ink.faint, colors.paper.DEFAULT],
    ["faint ink on deep paper", colors.ink.faint, colors.paper.deep],
    ["faint ink on white (cards, inputs)", colors.ink.faint, WHITE],
    ["faint ink on light teal (placed pieces)", colors.ink.faint, colors.teal.light],
    ["paper on persimmon (accent buttons)", colors.paper.DEFAULT, colors.persimmon.DEFAULT],
    [
      "paper on dark persimmon (accent buttons, hover)",
      colors.paper.DEFAULT,
      colors.persimmon.dark,
    ],
    ["paper on ink (primary buttons)", colors.paper.DEFAULT, colors.ink.DEFAULT],
    ["paper on dark teal (primary buttons, hover)", colors.paper.DEFAULT, colors.teal.dark],
    ["dark persimmon on paper (errors)", colors.persimmon.dark, colors.paper.DEFAULT],
    ["dark persimmon on deep paper", colors.persimmon.dark, colors.paper.deep],
    [
      "dark persimmon on light persimmon (error notices)",
      colors.persimmon.dark,
      colors.persimmon.light,
    ],
    ["dark teal on paper (links, good news)", colors.teal.dark, colors.paper.DEFAULT],
    ["ink on light mustard (warnings)", colors.ink.DEFAULT, colors.mustard.light],
  ];
  it.each(pairs)("%s", (_name, fg, bg) => {
    expect(contrast(fg, bg)).toBeGreaterThanOrEqual(TEXT);
  });
});

describe("Quireline's component colours reach 3:1 (WCAG 2.2 SC 1.4.11)", () => {
  const pairs: [string, string, string][] = [
    ["teal focus outline on paper", colors.teal.DEFAULT, colors.paper.DEFAULT],
    ["teal focus outline on deep paper", colors.teal.DEFAULT, colors.paper.deep],
    ["persimmon border of a page with a problem, on white", colors.persimmon.DEFAULT, WHITE],
    ["persimmon accent button on paper", colors.persimmon.DEFAULT, colors.paper.DEFAULT],
  ];
  it.each(pairs)("%s", (_name, fg, bg) => {
    expect(contrast(fg, bg)).toBeGreaterThanOrEqual(NON_TEXT);
  });
});

describe("the palette before the darkening did not pass (so the checks above can fail)", () => {
  it("the old persimmon #c8553d gave 3.87:1 under paper text, the old faint ink #7b8178 3.55:1 on paper", () => {
    expect(contrast(colors.paper.DEFAULT, "#c8553d")).toBeCloseTo(3.87, 2);
    expect(contrast("#7b8178", colors.paper.DEFAULT)).toBeCloseTo(3.55, 2);
  });
});
