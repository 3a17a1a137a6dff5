import type { MapEventView } from "@/lib/map-edits/payload";

/** Who changed the map, what and when, newest first. */
export function HistoryPanel({ events }: { events: MapEventView[] }) {
  return (
    <section aria-labelledby="history-title" className="flex flex-col gap-2">
      <h2 id="history-title" className="text-lg font-semibold">
        History
      </h2>
      {events.length === 0 ? (
        <p className="text-sm text-ink-soft">No changes yet.</p>
      ) : (
        <ol
          // It scrolls, so keyboard users need to be able to reach it (WCAG 2.2 SC 2.1.1).
          tabIndex={0}
          aria-labelledby="history-title"
          className="flex max-h-72 flex-col gap-1.5 overflow-y-auto text-xs"
          data-testid="map-history"
        >
          {events.map((e) => (
            <li key={e.id} className="border-l-2 border-ink/15 pl-2">
              <p>{e.summary}</p>
              <p className="text-ink-faint">
                {e.actorName} · {e.at.slice(0, 16).replace("T", " ")} UTC · version {e.mapVersion}
              </p>
            </li>
          ))}
        </ol>
      )}
    </section>
  );
}
