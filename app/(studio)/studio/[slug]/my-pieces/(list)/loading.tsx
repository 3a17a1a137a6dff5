/** Shown while the list of a contributor's pieces loads. */
export default function Loading() {
  return (
    <div
      className="flex flex-col gap-4"
      aria-busy="true"
      aria-live="polite"
      data-testid="my-pieces-loading"
    >
      <p className="text-sm text-ink-soft">Loading your pieces…</p>
      {[0, 1].map((n) => (
        <div
          key={n}
          className="flex h-24 animate-pulse items-center gap-4 rounded-lg border border-ink/10 bg-white/40 p-3"
        >
          <div className="h-20 w-16 rounded bg-paper-deep" />
          <div className="flex flex-1 flex-col gap-2">
            <div className="h-4 w-1/3 rounded bg-paper-deep" />
            <div className="h-3 w-1/2 rounded bg-paper-deep" />
          </div>
        </div>
      ))}
    </div>
  );
}
