/** Findings about colour against the print method, and the bit depth. */
import type { PrintSpec } from "../../spec";
import type { Finding, Measured } from "../types";

/** Codes the colour findings use; the full check replaces them once the pixels are seen. */
export const COLOUR_CODES = new Set([
  "colour-for-duplicator",
  "colour-for-black-printing",
  "cmyk-for-desktop-printer",
  "no-colour-profile",
  "grey-in-colour-file",
  "colour-in-separation",
]);

/** Colour findings; `colourfulShare` is known only after a decode (undefined from the header alone). */
export function colourFindings(
  spec: PrintSpec,
  measured: Measured,
  colourfulShare: number | undefined,
): Finding[] {
  const space = measured.colourSpace;
  const label = space === "cmyk" ? "CMYK" : space === "rgb" ? "RGB" : "colour";
  const inColour = space === "rgb" || space === "cmyk";
  // An RGB file whose pixels are all grey prints like a greyscale one.
  const lookGrey = colourfulShare !== undefined && colourfulShare < 0.001;
  const out: Finding[] = [];
  const ink = spec.separationInk;
  if (ink !== undefined && inColour) {
    // A master is one channel of tone: the duplicator reads only how dark each spot is.
    out.push(
      lookGrey
        ? {
            code: "grey-in-colour-file",
            severity: "note",
            message: `The ${ink} master is saved as ${label} but holds only greys; it will be used as a greyscale file.`,
            fix: "Nothing to do, or save it as greyscale.",
          }
        : {
            code: "colour-in-separation",
            severity: "warning",
            message: `This is the ${ink} master, but the file has colours in it. A master is a greyscale file: the press reads only how dark each spot is, so colours turn into greys you may not expect.`,
            fix: `Send a greyscale master for ${ink}: black where ${ink} prints fully, greys for lighter tones, white where it does not print.`,
          },
    );
    return out;
  }
  if (spec.printMethod === "duplicator" && inColour) {
    const inks = spec.inks.length;
    if (lookGrey) {
      out.push({
        code: "grey-in-colour-file",
        severity: "note",
        message: `The file is saved as ${label} but holds only greys; it will be used as a greyscale file.`,
        fix: "Nothing to do, or save it as greyscale.",
      });
    } else {
      out.push({
        code: "colour-for-duplicator",
        severity: inks > 1 ? "blocker" : "warning",
        message:
          inks > 1
            ? `The file is in ${label} colour; duplicator printing with ${inks} inks (${spec.inks.join(", ")}) needs one greyscale file per ink.`
            : `The file is in ${label} colour; duplicator printing with one ink (${spec.inks[0] ?? "black"}) takes a greyscale file, dark where the ink goes.`,
        fix:
          inks > 1
            ? `Separate the artwork into ${inks} greyscale files, one per ink, dark where that ink goes, and upload each.`
            : "Convert it to greyscale and check the contrast before uploading again.",
      });
    }
  }
  if (spec.printMethod === "laser-black" && inColour && !lookGrey)
    out.push({
      code: "colour-for-black-printing",
      severity: "note",
      message: `The file is in ${label} colour and will print in black only; colours become greys and some may look alike.`,
      fix: "Check a greyscale version for contrast.",
    });
  if ((spec.printMethod === "laser-colour" || spec.printMethod === "inkjet") && space === "cmyk")
    out.push({
      code: "cmyk-for-desktop-printer",
      severity: "note",
      message:
        "The file is CMYK; desktop laser and inkjet printers take RGB and convert it, so colours may shift.",
      fix: "If colours matter, export an RGB (sRGB) version.",
    });
  if (
    (spec.printMethod === "laser-colour" || spec.printMethod === "inkjet") &&
    inColour &&
    !measured.hasIcc
  )
    out.push({
      code: "no-colour-profile",
      severity: "note",
      message: `The ${label} file carries no colour profile, so its colours will be read as ${space === "cmyk" ? "generic CMYK" : "sRGB"}.`,
      fix: "Embed the profile when exporting if the colours were prepared for another one.",
    });
  return out;
}

/** Files with 16 bits per channel are reduced to 8 for printing. */
export function highBitDepthFinding(): Finding {
  return {
    code: "high-bit-depth",
    severity: "note",
    message: "The file has 16 bits per channel; printing uses 8, so it will be reduced.",
    fix: "Nothing to do, or save it at 8 bits to make the file smaller.",
  };
}
