/** The proposal's answer: the proposed map, what was placed and not, and the closing notes. */
import { countPasses } from "../passes";
import { pagesInWords, pieceName, plural } from "../state";
import type { MapState, Proposal, ProposedPlacement } from "../types";
import type { Item } from "./board";
import type { ProposalRun } from "./context";

/** Writes the board's placements of `pieces` into a copy of the map and sums up. */
export function finishProposal(run: ProposalRun, pieces: readonly Item[]): Proposal {
  const { state, byPage, chosen, unplaced, notes, pieceById, copies, perPass, centre } = run;
  const n = run.pageCount;
  const slots = Array.from({ length: n }, (_, i) => ({
    ...(byPage[i + 1] ?? {
      page: i + 1,
      reservation: null,
      pieceId: null,
      piecePageIndex: null,
      locked: false,
    }),
  }));
  const placed: ProposedPlacement[] = [];
  for (const t of [...pieces].sort((a, b) => a.piece.id - b.piece.id)) {
    const start = chosen.get(t.piece.id);
    if (start === undefined) continue;
    const pages = Array.from({ length: t.len }, (_, i) => start + i);
    pages.forEach((p, i) => {
      const slot = slots[p - 1];
      if (slot) {
        slot.pieceId = t.piece.id;
        slot.piecePageIndex = i + 1;
      }
    });
    placed.push({ pieceId: t.piece.id, pages });
  }
  unplaced.sort((a, b) => a.pieceId - b.pieceId);
  const next: MapState = { ...state, slots };
  const after = countPasses(next, copies);
  notes.push(
    `Placed ${plural(placed.length, "piece")}` +
      (unplaced.length
        ? `; ${plural(unplaced.length, "piece")} did not fit (${unplaced.map((u) => pieceName(pieceById.get(u.pieceId), u.pieceId)).join(", ")})`
        : "") +
      `. Drum passes per copy: ${run.passesBefore} before, ${after.passesPerCopy} after` +
      (copies !== 1 ? ` (${after.passesPerRun} for ${copies} copies)` : "") +
      `; a side needs its distinct inks ÷ ${perPass} per pass, rounded up.`,
  );
  for (const p of placed.filter(
    (x) => x.pages.length > 1 && pieceById.get(x.pieceId)?.kind === "spread",
  )) {
    const [l, r] = p.pages;
    if (l !== undefined && r !== undefined && centre && l !== centre[0])
      notes.push(
        `${pieceName(pieceById.get(p.pieceId), p.pieceId)} on ${pagesInWords(p.pages)} crosses two sheets; its halves must line up when folded.`,
      );
  }
  return {
    state: next,
    passesBefore: run.passesBefore,
    passesAfter: after.passesPerCopy,
    placed,
    unplaced,
    notes,
  };
}
