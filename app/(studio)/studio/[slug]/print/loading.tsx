export default function Loading() {
  return (
    <p className="text-sm text-ink-soft" data-testid="print-loading" aria-live="polite">
      Opening the print files…
    </p>
  );
}
