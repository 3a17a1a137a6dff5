import { isPieceVerdict, PIECE_VERDICT_LABELS, type PieceVerdict } from "@/lib/pieces/verdict";

/** Each verdict has its own shape, so it reads without colour: octagon, dashed box, triangle, circle, tick. */
function VerdictShape({ verdict }: { verdict: PieceVerdict }) {
  const common = {
    viewBox: "0 0 16 16",
    className: "h-4 w-4 shrink-0",
    "aria-hidden": true,
  } as const;
  switch (verdict) {
    case "blocker":
      return (
        <svg {...common}>
          <path d="M5 1h6l4 4v6l-4 4H5l-4-4V5z" className="fill-persimmon" />
          <path d="M4.5 8h7" className="stroke-paper" strokeWidth="2" />
        </svg>
      );
    case "missing":
      return (
        <svg {...common}>
          <rect
            x="2"
            y="2"
            width="12"
            height="12"
            rx="1"
            fill="none"
            className="stroke-ink-soft"
            strokeWidth="1.5"
            strokeDasharray="2.5 2"
          />
        </svg>
      );
    case "warning":
      return (
        <svg {...common}>
          <path d="M8 1.5 15 14.5H1z" className="fill-mustard" />
          <path d="M8 6v4.2M8 11.8v1" className="stroke-ink" strokeWidth="1.6" />
        </svg>
      );
    case "note":
      return (
        <svg {...common}>
          <circle cx="8" cy="8" r="6.2" fill="none" className="stroke-teal" strokeWidth="1.6" />
          <path d="M8 7v4.5M8 4.6v1" className="stroke-teal" strokeWidth="1.6" />
        </svg>
      );
    case "pass":
      return (
        <svg {...common}>
          <circle cx="8" cy="8" r="7" className="fill-teal" />
          <path
            d="m4.6 8.2 2.3 2.3 4.5-4.8"
            fill="none"
            className="stroke-paper"
            strokeWidth="1.8"
          />
        </svg>
      );
  }
}

/** A spec verdict as a shape and a word. Unknown values (from older data) show as text. */
export function VerdictBadge({ verdict, className = "" }: { verdict: string; className?: string }) {
  if (!isPieceVerdict(verdict)) return <span className={className}>{verdict}</span>;
  return (
    <span
      className={`inline-flex items-center gap-1.5 whitespace-nowrap ${className}`}
      data-verdict={verdict}
    >
      <VerdictShape verdict={verdict} />
      {PIECE_VERDICT_LABELS[verdict]}
    </span>
  );
}
