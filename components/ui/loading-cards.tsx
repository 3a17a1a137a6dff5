/**
 * A loading state of a few pulsing cards under a one-line message, for lists of pieces and pages.
 * `tall` is for a piece's pages with their reports; the short cards are list rows.
 */
export function LoadingCards({
  message,
  testId,
  tall = false,
}: {
  message: string;
  testId: string;
  tall?: boolean;
}) {
  return (
    <div className="flex flex-col gap-4" aria-busy="true" aria-live="polite" data-testid={testId}>
      <p className="text-sm text-ink-soft">{message}</p>
      {[0, 1].map((n) => (
        <div
          key={n}
          className={`flex animate-pulse gap-4 rounded-lg border border-ink/10 bg-white/40 p-3 ${tall ? "h-40" : "h-24 items-center"}`}
        >
          <div className={`rounded bg-paper-deep ${tall ? "h-32 w-24" : "h-20 w-16"}`} />
          <div className="flex flex-1 flex-col gap-2">
            <div className="h-4 w-1/3 rounded bg-paper-deep" />
            <div className="h-3 w-1/2 rounded bg-paper-deep" />
          </div>
        </div>
      ))}
    </div>
  );
}
