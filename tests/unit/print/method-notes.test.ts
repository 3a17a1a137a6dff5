import { describe, expect, it } from "vitest";
import { inksPerPassNote } from "@/lib/print/method-notes";
import { PRINT_METHODS } from "@/lib/print/spec";

describe("inksPerPassNote", () => {
  it("tells a duplicator's editor that each ink is a pass", () => {
    // Fancyclopedia "Mimeography": each copy sheet is run through once per colour.
    expect(inksPerPassNote("duplicator")).toBe("A stencil duplicator lays one ink per pass.");
  });

  it("says nothing of stencils for a laser or inkjet printer", () => {
    for (const method of PRINT_METHODS.filter((m) => m !== "duplicator"))
      expect(inksPerPassNote(method), method).toBeUndefined();
    expect(inksPerPassNote("laser-black")).toBeUndefined();
    expect(inksPerPassNote(undefined)).toBeUndefined();
  });
});
