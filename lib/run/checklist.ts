/**
 * The finishing checklist of a batch, drawn from the print spec: which steps the booklet needs,
 * in the order the job goes (trim the printed sheets, score heavy cover stock, fold, collate,
 * staple, trim the fore-edge), each with what to do and the usual cautions for the tool. The
 * cautions are the ordinary ones; a workshop's own safety rules come first.
 */
import type { Binding, CoverStock } from "@/lib/domain";
import { bookletCreepMm, closedThicknessMm, bookletCalipersMm } from "@/lib/print/creep";
import { shouldScore, SCORE_FROM_GSM } from "@/lib/print/paper";
import { roundTo } from "@/lib/print/units";
import type { FinishingStep } from "@/lib/print/finishing";
import type { StepTimings } from "./prices";

export const FINISHING_STEP_IDS = [
  "trim-sheets",
  "score-cover",
  "fold",
  "collate",
  "staple",
  "trim-fore-edge",
] as const;
export type FinishingStepId = (typeof FINISHING_STEP_IDS)[number];

export interface ChecklistStep {
  id: FinishingStepId;
  label: string;
  /** What to do, with this booklet's figures. */
  detail: string;
  cautions: string[];
}

export interface BookletShape {
  binding: Binding;
  /** Pages laid out on sheets (a saddle stitch is padded to a multiple of 4). */
  laidOutPages: number;
  sheetsPerCopy: number;
  trimWidthMm: number;
  trimHeightMm: number;
  bleedMm: number;
  paperGsm: number;
  paperCaliperMm: number;
  coverStock: CoverStock;
  coverPaperGsm: number | null;
}

/** Said under every checklist: the workshop's rules outrank these notes. */
export const SAFETY_DEFERRAL =
  "These are the usual cautions, not a safety briefing: your workshop's own rules and the tool maker's instructions come first.";

const BLADE_CAUTIONS = [
  "Cut away from the hand that holds the sheet, with a steel rule between blade and fingers.",
  "Retract or cover the blade whenever you put the knife down; snap off dull segments into a closed container.",
];
const GUILLOTINE_CAUTIONS = [
  "One person at the guillotine at a time; keep both hands clear of the blade's path and use the clamp.",
  "Lock the blade down or the handle up as the machine requires whenever you step away.",
];
const STAPLER_CAUTIONS = [
  "Keep fingers out of the stapler's throat while stapling; clear a jam with the stapler closed or unplugged.",
  "A long-reach stapler's arm is heavy: support it and do not let it drop onto a hand.",
];

/**
 * Staples along the spine: 2 for a spine up to 250 mm (A5, half letter, digest), 3 above it
 * (A4, letter). Common practice, no source.
 */
export function staplesPerCopy(binding: Binding, trimHeightMm: number): number {
  if (binding !== "saddle-stitch") return 0;
  return trimHeightMm > 250 ? 3 : 2;
}

/**
 * Reach of an ordinary desk stapler, from the edge of the paper to the staple, about 60 mm
 * (value from memory, no source); a saddle-stitched sheet is stapled on its centre fold, one
 * trimmed page width from the edge, so most booklets need a long-reach or saddle stapler.
 */
export const DESK_STAPLER_REACH_MM = 60;

/**
 * Push-out of the innermost sheet from which the fore-edge is trimmed after stapling, 0.5 mm.
 * Common practice, no source: below it the stepped edge is hard to see.
 */
export const TRIM_FORE_EDGE_FROM_MM = 0.5;

/** The steps a booklet of this shape needs, with its figures in their words. */
export function finishingChecklist(shape: BookletShape): ChecklistStep[] {
  const steps: ChecklistStep[] = [];
  const flatWidth = roundTo(2 * shape.trimWidthMm, 1);
  const height = roundTo(shape.trimHeightMm, 1);
  const single = shape.sheetsPerCopy <= 1;
  if (shape.bleedMm > 0)
    steps.push({
      id: "trim-sheets",
      label: "Trim the printed sheets",
      detail: `Cut each printed sheet to ${flatWidth} × ${height} mm flat, taking off the ${roundTo(shape.bleedMm, 1)} mm bleed and the printer's margin at head and foot.`,
      cautions: [...GUILLOTINE_CAUTIONS, ...BLADE_CAUTIONS.slice(0, 1)],
    });
  const coverGsm =
    shape.coverStock === "separate" ? (shape.coverPaperGsm ?? shape.paperGsm) : shape.paperGsm;
  if (shouldScore(coverGsm))
    steps.push({
      id: "score-cover",
      label: "Score the cover",
      detail: `The ${coverGsm} g/m² cover is at or over ${SCORE_FROM_GSM} g/m²: score it along the fold with a bone folder and a rule before folding, so it does not crack.`,
      cautions: [
        "Hold the rule firmly and keep fingers behind its edge; a scoring wheel is a blunt blade.",
      ],
    });
  steps.push({
    id: "fold",
    label: "Fold",
    detail: single
      ? "Fold the sheet on its marks and crease it with a bone folder."
      : `Fold each of the ${shape.sheetsPerCopy} sheets in half, printed side out as imposed, and crease with a bone folder.`,
    cautions: ["Paper edges cut: run the bone folder along the fold, not a finger."],
  });
  if (!single)
    steps.push({
      id: "collate",
      label: "Collate",
      detail: `Nest the ${shape.sheetsPerCopy} folded sheets in order, sheet 1 outside${shape.coverStock === "separate" ? " (the cover stock)" : ""}, and check the page numbers run 1 to ${shape.laidOutPages}.`,
      cautions: ["Stack finished piles low; a tall pile slides off the table."],
    });
  if (shape.binding === "saddle-stitch") {
    const count = staplesPerCopy(shape.binding, shape.trimHeightMm);
    const reach = roundTo(shape.trimWidthMm, 1);
    const calipers = bookletCalipersMm(shape.sheetsPerCopy, shape);
    const thickness = roundTo(closedThicknessMm(calipers), 1);
    steps.push({
      id: "staple",
      label: "Staple",
      detail:
        `${count} staples through the centre fold, each about a quarter of the ${height} mm spine in from its end. ` +
        `The fold is ${reach} mm from the sheet's edge` +
        (reach > DESK_STAPLER_REACH_MM
          ? `, beyond a desk stapler's reach of about ${DESK_STAPLER_REACH_MM} mm: use a long-reach or saddle stapler.`
          : ".") +
        ` The closed booklet is about ${thickness} mm thick; pick staple legs that go through it and fold flat.`,
      cautions: STAPLER_CAUTIONS,
    });
    const creep = bookletCreepMm(shape.sheetsPerCopy, shape);
    const push = creep[creep.length - 1] ?? 0;
    if (push >= TRIM_FORE_EDGE_FROM_MM)
      steps.push({
        id: "trim-fore-edge",
        label: "Trim the fore-edge",
        detail: `The innermost sheet sticks out about ${roundTo(push, 2)} mm at the fore-edge (creep): trim the stapled booklet's fore-edge straight, a few copies at a time.`,
        cautions: GUILLOTINE_CAUTIONS,
      });
  }
  return steps;
}

/** The checklist's steps with the editor's timings, for finishing time and costs (untimed steps take no minutes). */
export function timedSteps(
  checklist: readonly ChecklistStep[],
  timings: StepTimings,
): FinishingStep[] {
  return checklist.map((s) => ({
    id: s.id,
    label: s.label,
    setupMinutes: timings[s.id]?.setupMinutes ?? 0,
    minutesPerCopy: timings[s.id]?.minutesPerCopy ?? 0,
  }));
}
