export default function Loading() {
  return (
    <p className="text-sm text-ink-soft" data-testid="finishing-loading" aria-live="polite">
      Opening the finishing batches…
    </p>
  );
}
