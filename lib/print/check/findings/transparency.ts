/** Findings about an alpha channel and the transparent parts of an image. */
import type { Finding } from "../types";

/** The alpha finding; `transparentShare` is known only after a decode (undefined from the header alone). */
export function alphaFinding(transparentShare: number | undefined): Finding {
  if (transparentShare === undefined)
    return {
      code: "alpha-channel",
      severity: "note",
      message:
        "The file has a transparency (alpha) channel; any transparent areas will print as bare paper.",
      fix: "Flatten it onto the background you want before exporting.",
    };
  if (transparentShare > 0)
    return {
      code: "transparency",
      severity: "warning",
      message: `About ${Math.max(1, Math.round(transparentShare * 100))}% of the image is transparent; transparent areas print as bare paper.`,
      fix: "Flatten it onto white, or onto the colour you want, before exporting.",
    };
  return {
    code: "alpha-channel",
    severity: "note",
    message: "The file has a transparency (alpha) channel, but every pixel is opaque.",
    fix: "Nothing to do, or export without transparency to make the file smaller.",
  };
}
