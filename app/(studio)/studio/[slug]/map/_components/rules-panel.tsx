import type { MapCheck } from "@/lib/map/types";

/** The rule messages of the map in plain words; a message about pages selects its first page. */
export function RulesPanel({
  check,
  onShowPage,
}: {
  check: MapCheck;
  onShowPage: (page: number) => void;
}) {
  return (
    <section aria-labelledby="rules-title" data-testid="map-rules" className="flex flex-col gap-2">
      <h2 id="rules-title" className="text-lg font-semibold">
        Rules
      </h2>
      {check.messages.length === 0 ? (
        <p className="text-sm text-ink-soft" data-testid="rules-clear">
          Nothing to fix: the map follows every rule.
        </p>
      ) : null}
      {check.errors.length ? (
        <p className="text-xs font-semibold text-persimmon-dark">
          To fix before printing ({check.errors.length})
        </p>
      ) : null}
      <ul className="flex flex-col gap-1.5" aria-live="polite">
        {check.messages.map((m, i) => (
          <li
            key={`${m.code}-${i}`}
            data-code={m.code}
            data-severity={m.severity}
            data-testid="rule-message"
            className={`rounded border-l-4 px-2 py-1 text-xs ${m.severity === "error" ? "border-persimmon bg-persimmon-light/40" : "border-mustard bg-mustard-light/40"}`}
          >
            <span className="sr-only">{m.severity === "error" ? "Problem: " : "Note: "}</span>
            {m.message}
            {m.pages.length ? (
              <button
                type="button"
                className="ml-1 font-semibold text-teal-dark underline"
                onClick={() => onShowPage(m.pages[0]!)}
              >
                show page {m.pages[0]}
              </button>
            ) : null}
          </li>
        ))}
      </ul>
    </section>
  );
}
