/**
 * Notes the spec form shows beside a field only where they hold for the chosen print method.
 * A stencil duplicator runs each sheet through once per ink drum ("each copy sheet is run thru
 * the mimeo as many times as there are colors", Fancyclopedia "Mimeography"); a laser or inkjet
 * printer lays all its colours in one pass, so the same note would mislead there.
 */
import type { PrintMethod } from "./spec";

/** The hint beside "Inks per pass": only for the duplicator. */
export function inksPerPassNote(method: PrintMethod | undefined): string | undefined {
  return method === "duplicator" ? "A stencil duplicator lays one ink per pass." : undefined;
}
