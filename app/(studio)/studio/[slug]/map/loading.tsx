export default function Loading() {
  return (
    <p className="text-sm text-ink-soft" data-testid="map-loading" aria-live="polite">
      Opening the page map…
    </p>
  );
}
