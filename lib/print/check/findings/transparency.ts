/** Findings about an alpha channel and the transparent parts of an image. */
import type { Finding, TransparencyStats } from "../types";

/** A share as people read it: "0%", "under 1%", "37%", "over 99%", "100%". */
export function percentText(share: number): string {
  if (share <= 0) return "0%";
  if (share >= 1) return "100%";
  if (share < 0.005) return "under 1%";
  if (share >= 0.995) return "over 99%";
  return `${Math.round(share * 100)}%`;
}

/**
 * The alpha finding. From the header alone (`stats` undefined) only that there is an alpha
 * channel; after a decode, how much of the image is fully or mostly transparent (under 50%
 * opacity, the threshold in ../edges.ts) and how opaque it is on average.
 */
export function alphaFinding(stats: TransparencyStats | undefined): Finding {
  if (stats === undefined)
    return {
      code: "alpha-channel",
      severity: "note",
      message:
        "The file has a transparency (alpha) channel; any transparent areas will print as bare paper.",
      fix: "Flatten it onto the background you want before exporting.",
    };
  if (stats.notOpaqueShare === 0)
    return {
      code: "alpha-channel",
      severity: "note",
      message: "The file has a transparency (alpha) channel, but every pixel is opaque.",
      fix: "Nothing to do, or export without transparency to make the file smaller.",
    };
  const fix = "Flatten it onto white, or onto the colour you want, before exporting.";
  if (stats.meanOpacity === 0)
    return {
      code: "transparency",
      severity: "warning",
      message: "Every pixel is fully transparent: the page would print as bare paper.",
      fix: "Check that the right layer was exported; then flatten it onto the background you want.",
    };
  return {
    code: "transparency",
    severity: "warning",
    message:
      `${capitalise(percentText(stats.mostlyTransparentShare))} of the pixels are fully or mostly transparent; ` +
      `average opacity is ${percentText(stats.meanOpacity)}. Transparent parts print as bare paper and half-transparent ones paler than they look.`,
    fix,
  };
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
