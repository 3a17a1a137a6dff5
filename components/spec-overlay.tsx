import type { Measured } from "@/lib/print/check";
import { formatLength } from "@/lib/format";
import { overlayLayout, type OverlaySpec, type Rect } from "@/lib/pieces/overlay";

const PLACEMENT_TEXT = {
  "fills-bleed": "The file covers the page with its bleed.",
  "fills-trim": "The file is the trim size: the band between the trim and bleed lines is empty.",
  "covers-page":
    "The file's proportions differ from the page: it is shown scaled to cover the page; what lies outside the bleed line is cut off.",
  "pdf-boxes": "PDF page placed by its own page boxes.",
  none: "No picture could be read from this file.",
} as const;

const box = (r: Rect) => ({ x: r.x, y: r.y, width: r.width, height: r.height });

/**
 * A file's thumbnail with the page's bleed (outer), trim (cut) and safe-area (inner) lines drawn
 * over it, to scale. Used on the contributor's piece page and in the editors' review.
 */
export function SpecOverlay({
  spec,
  measured,
  format,
  thumbnailUrl,
  alt,
  className = "",
  testId,
}: {
  spec: OverlaySpec;
  measured: Measured | null | undefined;
  format?: string;
  thumbnailUrl: string | null;
  alt: string;
  className?: string;
  testId?: string;
}) {
  const layout = overlayLayout(spec, measured, format);
  const { view, image } = layout;
  const stroke = Math.max(view.width, view.height) / 260;
  const outside = image ? `M${view.x},${view.y}h${view.width}v${view.height}h${-view.width}z` : "";
  const bleedHole = `M${layout.bleed.x},${layout.bleed.y}v${layout.bleed.height}h${layout.bleed.width}v${-layout.bleed.height}z`;
  return (
    <figure className={`flex flex-col gap-2 ${className}`} data-testid={testId}>
      <svg
        viewBox={`${view.x} ${view.y} ${view.width} ${view.height}`}
        role="img"
        aria-label={`${alt}. ${PLACEMENT_TEXT[layout.placement]}`}
        className="h-auto w-full rounded border border-ink/10 bg-paper-deep"
      >
        <rect {...box(layout.bleed)} fill="#ffffff" />
        {image && thumbnailUrl ? (
          <image href={thumbnailUrl} {...box(image)} preserveAspectRatio="none" />
        ) : image ? (
          <rect {...box(image)} fill="#e5e0d4" />
        ) : null}
        {/* Whatever lies beyond the bleed line is trimmed away: shade it. */}
        {image ? (
          <path d={`${outside}${bleedHole}`} fill="#1f2a24" fillOpacity={0.35} fillRule="evenodd" />
        ) : null}
        <rect
          {...box(layout.bleed)}
          fill="none"
          className="stroke-line-bleed"
          strokeWidth={stroke}
          strokeDasharray={`${stroke * 4} ${stroke * 2}`}
        />
        <rect
          {...box(layout.trim)}
          fill="none"
          className="stroke-line-trim"
          strokeWidth={stroke * 1.3}
        />
        {layout.safe ? (
          <rect
            {...box(layout.safe)}
            fill="none"
            className="stroke-line-safe"
            strokeWidth={stroke}
            strokeDasharray={`${stroke * 2} ${stroke * 2}`}
          />
        ) : null}
      </svg>
      <figcaption className="flex flex-col gap-1 text-xs text-ink-soft">
        <span className="flex flex-wrap gap-x-3 gap-y-1">
          <span className="inline-flex items-center gap-1">
            <span
              aria-hidden="true"
              className="inline-block h-0 w-4 border-t-2 border-dashed border-line-bleed"
            />{" "}
            bleed ({formatLength(spec.bleedMm)})
          </span>
          <span className="inline-flex items-center gap-1">
            <span aria-hidden="true" className="inline-block h-0 w-4 border-t-2 border-line-trim" />{" "}
            trim
          </span>
          <span className="inline-flex items-center gap-1">
            <span
              aria-hidden="true"
              className="inline-block h-0 w-4 border-t-2 border-dotted border-line-safe"
            />{" "}
            safe area ({formatLength(spec.safeMarginMm)} in)
          </span>
        </span>
        <span>{PLACEMENT_TEXT[layout.placement]}</span>
      </figcaption>
    </figure>
  );
}
