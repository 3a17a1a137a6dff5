export default function Loading() {
  return (
    <p className="text-sm text-ink-soft" data-testid="run-loading" aria-live="polite">
      Counting sheets and prices…
    </p>
  );
}
