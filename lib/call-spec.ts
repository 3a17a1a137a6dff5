/**
 * The print spec a contributor needs to make a piece, in plain words, drawn from the anthology's
 * spec (`specOf(anthology, { inks: call.allowedInks })`): trim, bleed, size with bleed, safe
 * margin, resolution, pixel size and colour mode. Pure; shown on the studio call page and the
 * public call page.
 */
import { formatLength, mmText, sizeInBothUnits } from "@/lib/format";
import { SUPPORTED_FORMATS_TEXT } from "@/lib/print/check/types";
import { findPreset } from "@/lib/print/sizes";
import { bleedBoxOf, pixelsFor, type PrintMethod, type PrintSpec } from "@/lib/print/spec";

export interface CallSpecSummary {
  rows: { key: string; label: string; value: string }[];
  /** Trim plus bleed at the minimum resolution: the size to draw or scan at. */
  pixels: { widthPx: number; heightPx: number; ppi: number };
  colourMode: string;
}

/** The colour mode files must be in for a print method; `inks` are the inks a piece may use. */
export function colourModeText(printMethod: PrintMethod, inks: readonly string[]): string {
  switch (printMethod) {
    case "duplicator":
      // Stencil duplicators print one ink per drum pass (Fancyclopedia 1 (c. 1944), "Mimeography", fancyclopedia.wikidot.com/mimeography);
      // one greyscale file per ink is common practice, no source.
      return inks.length > 1
        ? `One greyscale file per ink (${inks.join(", ")}), dark where that ink prints`
        : `Greyscale, dark where the ${inks[0] ?? "black"} ink prints`;
    case "laser-black":
      return "Greyscale; colour files print in black only, as greys";
    case "laser-colour":
    case "inkjet":
      return "RGB colour (sRGB); CMYK files are converted by the printer";
  }
}

/** The spec summary rows; build the spec with the call's inks so the colour row names them. */
export function callSpecSummary(a: PrintSpec): CallSpecSummary {
  const preset = a.trimPreset ? findPreset(a.trimPreset) : undefined;
  const inchesFirst = Boolean(preset?.inches);
  const trimMm = `${mmText(a.trimWidthMm)} x ${mmText(a.trimHeightMm)} mm`;
  const presetName = preset
    ? `${preset.label}${a.trimWidthMm > a.trimHeightMm ? ", landscape" : ""}`
    : "";
  const trimText = preset?.inches
    ? `${presetName}, ${trimMm}`
    : preset
      ? `${presetName}, ${sizeInBothUnits(a.trimWidthMm, a.trimHeightMm, false)}`
      : sizeInBothUnits(a.trimWidthMm, a.trimHeightMm, false);
  const withBleed = bleedBoxOf(a);
  const { widthPx, heightPx } = pixelsFor(withBleed, a.minPpi);
  const colourMode = colourModeText(a.printMethod, a.inks);
  return {
    pixels: { widthPx, heightPx, ppi: a.minPpi },
    colourMode,
    rows: [
      { key: "trim", label: "Trim (finished page)", value: trimText },
      {
        key: "bleed",
        label: "Bleed",
        value: `${formatLength(a.bleedMm)} past the trim on every side`,
      },
      {
        key: "with-bleed",
        label: "Page with bleed",
        value: sizeInBothUnits(withBleed.widthMm, withBleed.heightMm, inchesFirst),
      },
      {
        key: "safe",
        label: "Safe margin",
        value: `${formatLength(a.safeMarginMm)} inside the trim: keep words and faces within it`,
      },
      { key: "ppi", label: "Resolution", value: `at least ${a.minPpi} ppi at print size` },
      {
        key: "pixels",
        label: "Pixel size",
        value: `${widthPx} x ${heightPx} px (page with bleed at ${a.minPpi} ppi)`,
      },
      { key: "colour", label: "Colour", value: colourMode },
      { key: "files", label: "Files", value: `${SUPPORTED_FORMATS_TEXT}, one file per page` },
    ],
  };
}
