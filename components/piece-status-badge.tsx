import { PIECE_STATUS_LABELS, type PieceStatus } from "@/lib/domain";

const TONES: Record<PieceStatus, string> = {
  "awaiting-review": "border-ink/30 bg-paper",
  "fix-requested": "border-mustard bg-mustard-light",
  shortlisted: "border-teal/50 bg-teal-light/60",
  accepted: "border-teal bg-teal text-paper",
  declined: "border-ink/20 bg-paper-deep text-ink-soft",
  withdrawn: "border-dashed border-ink/30 text-ink-faint",
};

/** A piece's status in its plain-English label; the colour only repeats what the words say. */
export function PieceStatusBadge({ status }: { status: PieceStatus }) {
  return (
    <span
      className={`inline-block whitespace-nowrap rounded-full border px-2 py-0.5 text-xs font-semibold ${TONES[status]}`}
      data-status={status}
    >
      {PIECE_STATUS_LABELS[status]}
    </span>
  );
}
