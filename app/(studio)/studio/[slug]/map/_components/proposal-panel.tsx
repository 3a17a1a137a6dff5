import { Button } from "@/components/ui/button";
import type { ProposalAnswer } from "@/lib/map-edits/payload";
import type { PieceView } from "./view-model";

/** A proposal on show (not saved): the passes it saves, where it puts pieces, what it could not place and why. */
export function ProposalPanel({
  answer,
  pieces,
  busy,
  onAccept,
  onDiscard,
}: {
  answer: ProposalAnswer;
  pieces: Map<number, PieceView>;
  busy: boolean;
  onAccept: () => void;
  onDiscard: () => void;
}) {
  const { proposal } = answer;
  const title = (id: number) => pieces.get(id)?.title ?? `piece ${id}`;
  return (
    <section
      aria-labelledby="proposal-title"
      data-testid="proposal-panel"
      className="flex flex-col gap-2 rounded-md border-2 border-dashed border-teal bg-teal-light/30 p-4 text-sm"
    >
      <h2 id="proposal-title" className="text-lg font-semibold">
        Proposed layout (not saved yet)
      </h2>
      <p data-testid="proposal-passes">
        Passes per copy: <strong>{proposal.passesBefore}</strong> now,{" "}
        <strong>{proposal.passesAfter}</strong> with this proposal (
        {answer.passes.passesPerRun.toLocaleString("en")} for {answer.copies} copies).
      </p>
      {proposal.placed.length ? (
        <div>
          <p className="font-semibold">It places</p>
          <ul className="list-disc pl-5" data-testid="proposal-placed">
            {proposal.placed.map((p) => (
              <li key={p.pieceId}>
                {title(p.pieceId)}:{" "}
                {p.pages.length === 1 ? `page ${p.pages[0]}` : `pages ${p.pages.join(", ")}`}
              </li>
            ))}
          </ul>
        </div>
      ) : (
        <p>There is nothing it can place.</p>
      )}
      {proposal.unplaced.length ? (
        <div>
          <p className="font-semibold">It could not place</p>
          <ul className="list-disc pl-5" data-testid="proposal-unplaced">
            {proposal.unplaced.map((u) => (
              <li key={u.pieceId}>
                {title(u.pieceId)}: {u.reason}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {proposal.notes.length ? (
        <ul className="flex flex-col gap-1 text-xs text-ink-soft" data-testid="proposal-notes">
          {proposal.notes.map((n, i) => (
            <li key={i}>{n}</li>
          ))}
        </ul>
      ) : null}
      <p className="text-xs text-ink-faint">
        The map below shows the proposal. Accepting saves it as one change; discarding leaves the
        map as it was.
      </p>
      <div className="flex gap-2">
        {proposal.placed.length ? (
          <Button type="button" onClick={onAccept} busy={busy} data-testid="proposal-accept">
            Accept proposal
          </Button>
        ) : null}
        <Button type="button" variant="quiet" onClick={onDiscard} data-testid="proposal-discard">
          Discard
        </Button>
      </div>
    </section>
  );
}
