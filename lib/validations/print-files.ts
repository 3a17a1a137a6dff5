import { z } from "zod";

/** The most a custom press sheet may measure on either side (B0 is 1000 x 1414 mm, ISO 216). */
export const MAX_SHEET_MM = 1500;

const sideMm = z
  .number({ error: "Give the size in millimetres." })
  .finite()
  .positive("A sheet side must be longer than 0 mm.")
  .max(MAX_SHEET_MM, `A sheet side can be at most ${MAX_SHEET_MM} mm.`);

/** POST /api/anthologies/<slug>/print-files: the press sheet, a named one or a custom size. */
export const produceRequestSchema = z.object({
  sheet: z.union(
    [
      z.string().trim().min(1, "Choose a press sheet.").max(40),
      z.object({ widthMm: sideMm, heightMm: sideMm }),
    ],
    { error: "Choose a press sheet, or give a custom width and height in millimetres." },
  ),
});

export type ProduceRequest = z.infer<typeof produceRequestSchema>;
