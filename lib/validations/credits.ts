import { z } from "zod";
import { LENGTH } from "./limits";
import { singleLineText } from "./text";

/** A credit line as it will print: one plain line, capped to its column. */
export const creditLineField = singleLineText(LENGTH.creditLine).min(
  2,
  "Say how the name should appear in the credits",
);

/** The contributor's approval from the e-mail link: the line as they approve it (edited or not). */
export const creditApprovalSchema = z.object({ creditLine: creditLineField });
export type CreditApprovalInput = z.input<typeof creditApprovalSchema>;

/** An editor's or the contributor's change of a credit line. */
export const creditLineChangeSchema = z.object({ creditLine: creditLineField });

/** The editors' request for approvals: every outstanding piece, or the pieces named. */
export const creditRequestSchema = z.union([
  z.object({ scope: z.literal("outstanding") }),
  z.object({
    scope: z.literal("pieces"),
    pieceIds: z.array(z.number().int().positive()).min(1).max(500),
  }),
]);
export type CreditRequestInput = z.infer<typeof creditRequestSchema>;
