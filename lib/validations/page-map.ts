import { z } from "zod";
import { SLOT_RESERVATIONS } from "@/lib/domain";

const page = z
  .number({ error: "Give a page number" })
  .int("Whole page numbers only")
  .min(1, "Pages start at 1")
  .max(1000);
const pieceId = z.number({ error: "Choose a piece" }).int().positive();

/** One edit of the page map, as the map screen sends it and the route handler accepts it. */
export const mapChangeSchema = z.discriminatedUnion("op", [
  z.object({ op: z.literal("place"), pieceId, startPage: page }),
  z.object({ op: z.literal("move"), pieceId, startPage: page }),
  z.object({ op: z.literal("remove"), pieceId }),
  /** Marks an unplaced piece left out of this issue (true) or brings it back to the tray (false). */
  z.object({ op: z.literal("leave-out"), pieceId, leftOut: z.boolean() }),
  z.object({ op: z.literal("reserve"), page, reservation: z.enum(SLOT_RESERVATIONS).nullable() }),
  z.object({ op: z.literal("lock"), page, locked: z.boolean() }),
  z.object({
    op: z.literal("resize"),
    delta: z.union([z.literal(4), z.literal(-4)]),
    atPage: page,
    /** Removing pages that hold pieces is refused (naming them) unless the editor asks for those pieces to go back to the tray. */
    force: z.boolean().optional(),
  }),
  z.object({
    op: z.literal("apply-proposal"),
    placements: z
      .array(z.object({ pieceId, pages: z.array(page).min(1) }))
      .min(1, "The proposal places nothing")
      .max(500),
  }),
]);
export type MapChange = z.infer<typeof mapChangeSchema>;

/** A change plus the map version it was made against: a stale version is refused. */
export const mapChangeRequestSchema = z.object({
  version: z.number({ error: "Send the map version you are editing" }).int().min(0),
  change: mapChangeSchema,
});
export type MapChangeRequest = z.infer<typeof mapChangeRequestSchema>;

export const COPIES_DEFAULT = 100;
export const copiesSchema = z.coerce
  .number()
  .int()
  .min(1, "At least one copy")
  .max(100_000, "At most 100 000 copies");

/**
 * The map's query string: `?copies=` for the per-run pass figures; absent or empty means the
 * copies kept with the anthology (`planned_copies`).
 */
export const mapQuerySchema = z.object({
  copies: z.union([z.literal("").transform(() => undefined), copiesSchema]).optional(),
});

/** The sheet view's copies figure, kept with the anthology. */
export const plannedCopiesSchema = z.object({ copies: copiesSchema });

export const proposalRequestSchema = z.object({
  version: z.number().int().min(0),
  copies: copiesSchema.optional(),
});
