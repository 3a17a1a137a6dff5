export default function Loading() {
  return (
    <p className="text-sm text-ink-soft" data-testid="stock-loading" aria-live="polite">
      Counting sheets and copies…
    </p>
  );
}
