import { useQueryClient } from "@tanstack/react-query";
import {
  DndContext,
  DragOverlay,
  KeyboardSensor,
  PointerSensor,
  useSensor,
  useSensors,
  type Announcements,
  type DragEndEvent,
  type DragStartEvent,
} from "@dnd-kit/core";
import { useEffect, useMemo, useState } from "react";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { checkMap } from "@/lib/map/check";
import { countPasses } from "@/lib/map/passes";
import { slotsByPage, unplacedPieces } from "@/lib/map/state";
import type {
  MapPayload,
  MapRefusalAnswer,
  NoticesAnswer,
  NoticesPreviewAnswer,
  PlannedCopiesAnswer,
  ProposalAnswer,
} from "@/lib/map-edits/payload";
import type { MapChange } from "@/lib/validations/page-map";
import { pageKeyboardCoordinates, pageOfDropId, TRAY_DROP_ID, type DragData } from "./drag";
import { HistoryPanel } from "./history-panel";
import { NoticesConfirm } from "./notices-confirm";
import { PlaceDialog } from "./place-dialog";
import { ProposalPanel } from "./proposal-panel";
import { ReaderView } from "./reader-view";
import { ResizeForm } from "./resize-form";
import { RulesPanel } from "./rules-panel";
import { SheetView } from "./sheet-view";
import type { SlotMark } from "./slot-card";
import { SlotPanel } from "./slot-panel";
import { Tray } from "./tray";
import { mapKey, useMapChanges, useMapQuery } from "./use-map";
import { messagesByPage, piecesById, validStarts } from "./view-model";

type View = "reader" | "sheets";

/** The page map screen: tray, map (as read or as printed), rules, page controls, proposal and history. */
export function MapWorkspace({ slug, initial }: { slug: string; initial: MapPayload }) {
  const queryClient = useQueryClient();
  const query = useMapQuery(slug, initial);
  const map = query.data;
  const { send, feedback, setFeedback, saving } = useMapChanges(slug);
  const [view, setView] = useState<View>("reader");
  const [copiesText, setCopiesText] = useState(String(initial.anthology.plannedCopies));
  const [copiesNote, setCopiesNote] = useState<string | null>(null);
  const [selectedPage, setSelectedPage] = useState<number | null>(null);
  const [dialog, setDialog] = useState<{ mode: "place" | "move"; pieceId: number } | null>(null);
  const [drag, setDrag] = useState<DragData | null>(null);
  const [proposal, setProposal] = useState<ProposalAnswer | null>(null);
  const [proposalBusy, setProposalBusy] = useState(false);
  const [noticesBusy, setNoticesBusy] = useState(false);
  const [notices, setNotices] = useState<{ tone: "info" | "error"; text: string } | null>(null);
  const [noticesPreview, setNoticesPreview] = useState<NoticesPreviewAnswer | null>(null);
  // Dragging needs the client; tests and the page wait for this before they drag.
  const [hydrated, setHydrated] = useState(false);
  useEffect(() => setHydrated(true), []);

  const copiesNumber = Number(copiesText);
  const copiesValid =
    Number.isInteger(copiesNumber) && copiesNumber >= 1 && copiesNumber <= 100_000;
  const savedCopies = map.anthology.plannedCopies;
  const copies = copiesValid ? copiesNumber : savedCopies;

  // The copies figure is kept with the anthology, so it is the same after a reload.
  const saveCopies = async () => {
    if (!map.canEdit || !copiesValid || copiesNumber === savedCopies) return;
    try {
      const body = await fetchJson<PlannedCopiesAnswer>(`/api/anthologies/${slug}/map/copies`, {
        method: "PUT",
        json: { copies: copiesNumber },
        failure: (status) => `The copies were not saved (${status}).`,
        unreachable: "The server did not answer; the copies were not saved.",
      });
      queryClient.setQueryData<MapPayload>(mapKey(slug), (old) =>
        old ? { ...old, anthology: { ...old.anthology, plannedCopies: body.copies } } : old,
      );
      setCopiesNote(`Kept: ${body.copies} copies.`);
    } catch (error) {
      setCopiesNote(error instanceof Error ? error.message : "The copies were not saved.");
    }
  };

  const shown = proposal ? proposal.proposal.state : map.state;
  const editable = map.canEdit && proposal === null;
  const check = useMemo(() => checkMap(shown), [shown]);
  const passes = useMemo(() => countPasses(shown, copies), [shown, copies]);
  const pieces = useMemo(() => piecesById(shown, map.cards), [shown, map.cards]);
  const byPage = useMemo(() => messagesByPage(check.messages), [check]);
  const waiting = useMemo(
    () =>
      unplacedPieces(shown)
        .map((p) => pieces.get(p.id)!)
        .filter(Boolean),
    [shown, pieces],
  );
  const leftOut = useMemo(() => [...pieces.values()].filter((p) => p.leftOut), [pieces]);
  const slots = slotsByPage(shown);
  const selectedSlot = selectedPage !== null ? slots[selectedPage] : undefined;

  // While dragging, pages where the piece would be accepted are outlined and the rest dimmed.
  const dropStarts = useMemo(
    () =>
      drag
        ? new Set(validStarts(map.state, drag.pieceId, drag.from === "tray" ? "place" : "move"))
        : null,
    [drag, map.state],
  );
  const markFor = (page: number): SlotMark => {
    if (!drag || !dropStarts) return null;
    return dropStarts.has(page - (drag.index - 1)) ? "drop-ok" : "drop-no";
  };
  const flaggedPages = useMemo(
    () => new Set(feedback?.tone === "error" ? (feedback.pages ?? []) : []),
    [feedback],
  );

  const sensors = useSensors(
    useSensor(PointerSensor, { activationConstraint: { distance: 5 } }),
    useSensor(KeyboardSensor, {
      coordinateGetter: pageKeyboardCoordinates,
      // Enter is kept for the "choose a page" flow; Space picks up and drops.
      keyboardCodes: { start: ["Space"], cancel: ["Escape"], end: ["Space", "Enter"] },
    }),
  );

  const title = (id: number) => pieces.get(id)?.title ?? `piece ${id}`;
  const announcements: Announcements = {
    onDragStart: ({ active }) =>
      `Picked up ${title((active.data.current as DragData).pieceId)}. Use the arrow keys to move over a page, Space to drop, Escape to cancel.`,
    onDragOver: ({ active, over }) => {
      const page = pageOfDropId(over?.id);
      const name = title((active.data.current as DragData).pieceId);
      if (page !== null) return `${name} is over page ${page}.`;
      return over?.id === TRAY_DROP_ID
        ? `${name} is over the tray; dropping takes it off the map.`
        : `${name} is not over a page.`;
    },
    onDragEnd: ({ active, over }) => {
      const page = pageOfDropId(over?.id);
      const name = title((active.data.current as DragData).pieceId);
      return page !== null
        ? `Dropped ${name} on page ${page}.`
        : over?.id === TRAY_DROP_ID
          ? `${name} back to the tray.`
          : `${name} was not moved.`;
    },
    onDragCancel: ({ active }) =>
      `Cancelled; ${title((active.data.current as DragData).pieceId)} stays where it was.`,
  };

  const onDragStart = (event: DragStartEvent) => {
    setDrag((event.active.data.current as DragData | undefined) ?? null);
    setFeedback(null);
  };
  const onDragEnd = (event: DragEndEvent) => {
    const data = event.active.data.current as DragData | undefined;
    setDrag(null);
    if (!data || !event.over) return;
    const page = pageOfDropId(event.over.id);
    if (page !== null) {
      const startPage = page - (data.index - 1);
      if (data.from === "tray") void send({ op: "place", pieceId: data.pieceId, startPage });
      else void send({ op: "move", pieceId: data.pieceId, startPage });
    } else if (event.over.id === TRAY_DROP_ID && data.from === "map") {
      void send({ op: "remove", pieceId: data.pieceId });
    }
  };

  const askProposal = async () => {
    setProposalBusy(true);
    setFeedback(null);
    try {
      setProposal(
        await fetchJson<ProposalAnswer>(`/api/anthologies/${slug}/map/proposal`, {
          method: "POST",
          json: { version: map.version, copies },
          failure: (status) => `No proposal (${status}).`,
          unreachable: "The server did not answer; no proposal was made. Try again.",
        }),
      );
    } catch (error) {
      if (!(error instanceof ApiError)) throw error;
      const fresh = (error.body as Partial<MapRefusalAnswer>).map;
      if (fresh) queryClient.setQueryData(mapKey(slug), fresh);
      setFeedback({ tone: error.status === 409 ? "warn" : "error", text: error.message });
    } finally {
      setProposalBusy(false);
    }
  };

  const acceptProposal = async () => {
    if (!proposal) return;
    if (proposal.version !== map.version) {
      setProposal(null);
      setFeedback({
        tone: "warn",
        text: "The map changed since this proposal was made; ask for a fresh one.",
      });
      return;
    }
    setProposalBusy(true);
    const saved = await send({ op: "apply-proposal", placements: proposal.proposal.placed });
    setProposalBusy(false);
    setProposal(null);
    if (!saved) return;
  };

  // Sending waits for the editor to see who gets which pages.
  const previewNotices = async () => {
    setNoticesBusy(true);
    setNotices(null);
    setNoticesPreview(null);
    try {
      setNoticesPreview(
        await fetchJson<NoticesPreviewAnswer>(`/api/anthologies/${slug}/map/notices`, {
          cache: "no-store",
          failure: (status) => `Could not work out who to tell (${status}).`,
          unreachable: "The server did not answer; try again.",
        }),
      );
    } catch (error) {
      setNotices({
        tone: "error",
        text: error instanceof Error ? error.message : "The server did not answer; try again.",
      });
    } finally {
      setNoticesBusy(false);
    }
  };

  const sendNotices = async () => {
    setNoticesBusy(true);
    setNotices(null);
    try {
      const body = await fetchJson<NoticesAnswer>(`/api/anthologies/${slug}/map/notices`, {
        method: "POST",
        failure: (status) => `No notices were sent (${status}).`,
        unreachable: "The server did not answer; try again.",
      });
      if (body.contributors === 0) {
        setNotices({
          tone: "info",
          text: "No pieces are on the map yet, so there is nobody to tell.",
        });
      } else {
        const parts = [`Sent ${body.sent} ${body.sent === 1 ? "notice" : "notices"}`];
        if (body.alreadySent)
          parts.push(`${body.alreadySent} already had these pages and were not written to again`);
        if (body.failed) parts.push(`${body.failed} could not be sent (see the mail log)`);
        setNotices({ tone: body.failed ? "error" : "info", text: `${parts.join("; ")}.` });
      }
    } catch (error) {
      setNotices({
        tone: "error",
        text: error instanceof Error ? error.message : "The server did not answer; try again.",
      });
    } finally {
      setNoticesBusy(false);
      setNoticesPreview(null);
    }
  };

  const dialogPiece = dialog ? pieces.get(dialog.pieceId) : undefined;

  return (
    <DndContext
      id="page-map"
      sensors={sensors}
      onDragStart={onDragStart}
      onDragEnd={onDragEnd}
      onDragCancel={() => setDrag(null)}
      accessibility={{ announcements }}
    >
      <div
        className="flex flex-col gap-4"
        data-testid="map-screen"
        data-version={map.version}
        data-ready={hydrated ? "true" : "false"}
      >
        <div className="flex flex-wrap items-center gap-3 border-b border-ink/10 pb-3">
          <div
            role="group"
            aria-label="View"
            className="inline-flex overflow-hidden rounded-md border border-ink/30 text-sm"
          >
            {(
              [
                ["reader", "As read: spreads"],
                ["sheets", "As printed: sheets"],
              ] as const
            ).map(([value, label]) => (
              <button
                key={value}
                type="button"
                aria-pressed={view === value}
                data-testid={`view-${value}`}
                onClick={() => setView(value)}
                className={`px-3 py-1.5 ${view === value ? "bg-ink text-paper" : "bg-transparent hover:bg-paper-deep"}`}
              >
                {label}
              </button>
            ))}
          </div>
          <label className="flex items-center gap-2 text-sm">
            Copies
            <input
              id="copies"
              data-testid="copies"
              inputMode="numeric"
              value={copiesText}
              onChange={(e) => {
                setCopiesText(e.target.value);
                setCopiesNote(null);
              }}
              onBlur={() => void saveCopies()}
              onKeyDown={(e) => {
                if (e.key === "Enter") void saveCopies();
              }}
              aria-invalid={!copiesValid || undefined}
              className={`${inputClass} w-24 py-1`}
            />
          </label>
          {!copiesValid ? (
            <span className="text-xs text-persimmon-dark">
              Copies: a whole number from 1 to 100 000 (showing {savedCopies}).
            </span>
          ) : null}
          {copiesNote ? (
            <span className="text-xs text-ink-soft" aria-live="polite" data-testid="copies-note">
              {copiesNote}
            </span>
          ) : null}
          <span className="text-sm text-ink-soft">
            {passes.passesPerCopy} passes per copy · {passes.passesPerRun.toLocaleString("en")} for{" "}
            {copies}
          </span>
          <span
            className="ml-auto text-xs text-ink-faint"
            aria-live="polite"
            data-testid="map-saving"
          >
            {saving
              ? "Saving…"
              : query.isFetching
                ? "Checking for changes…"
                : `Version ${map.version}`}
          </span>
          {map.canEdit ? (
            <>
              <Button
                type="button"
                variant="accent"
                onClick={askProposal}
                busy={proposalBusy}
                disabled={proposal !== null || saving}
                data-testid="propose"
              >
                {proposalBusy ? "Working it out…" : "Propose a layout"}
              </Button>
              <Button
                type="button"
                variant="quiet"
                onClick={previewNotices}
                busy={noticesBusy && noticesPreview === null}
                disabled={noticesPreview !== null}
                data-testid="send-notices"
              >
                E-mail contributors their pages
              </Button>
            </>
          ) : null}
        </div>

        {query.isError ? (
          <Notice tone="error" testId="map-load-error">
            {query.error.message} The map below is the last one loaded.
          </Notice>
        ) : null}
        {feedback ? (
          <div data-testid="map-feedback" data-tone={feedback.tone} aria-live="polite">
            <Notice
              tone={feedback.tone === "info" ? "info" : feedback.tone === "warn" ? "warn" : "error"}
            >
              <div className="flex items-start justify-between gap-3">
                <span>{feedback.text}</span>
                <button
                  type="button"
                  className="text-xs underline"
                  onClick={() => setFeedback(null)}
                >
                  Dismiss
                </button>
              </div>
            </Notice>
          </div>
        ) : null}
        {noticesPreview ? (
          <NoticesConfirm
            preview={noticesPreview}
            busy={noticesBusy}
            onSend={() => void sendNotices()}
            onCancel={() => setNoticesPreview(null)}
          />
        ) : null}
        {notices ? (
          <Notice tone={notices.tone} testId="notices-result">
            {notices.text}
          </Notice>
        ) : null}
        {proposal ? (
          <ProposalPanel
            answer={proposal}
            pieces={pieces}
            busy={proposalBusy}
            onAccept={acceptProposal}
            onDiscard={() => setProposal(null)}
          />
        ) : null}

        <div className="grid gap-5 lg:grid-cols-[13rem_minmax(0,1fr)_17rem]">
          <div className="flex flex-col gap-4">
            <Tray
              pieces={waiting}
              leftOut={leftOut}
              canEdit={editable}
              onPlace={(pieceId) => setDialog({ mode: "place", pieceId })}
              onLeaveOut={(pieceId, leftOut) => void send({ op: "leave-out", pieceId, leftOut })}
            />
          </div>
          <div className="min-w-0">
            {view === "reader" ? (
              <ReaderView
                state={shown}
                pieces={pieces}
                byPage={byPage}
                selectedPage={selectedPage}
                flaggedPages={flaggedPages}
                markFor={markFor}
                canEdit={editable}
                onSelect={setSelectedPage}
              />
            ) : (
              <SheetView
                state={shown}
                pieces={pieces}
                passes={passes}
                creepMm={map.creepMm}
                coverStock={map.anthology.coverStock}
              />
            )}
          </div>
          <div className="flex flex-col gap-5">
            {selectedSlot ? (
              <SlotPanel
                slot={selectedSlot}
                piece={selectedSlot.pieceId !== null ? pieces.get(selectedSlot.pieceId) : undefined}
                messages={byPage.get(selectedSlot.page) ?? []}
                canEdit={editable}
                onChange={(change: MapChange) => void send(change)}
                onMove={(pieceId) => setDialog({ mode: "move", pieceId })}
                onClose={() => setSelectedPage(null)}
              />
            ) : null}
            <RulesPanel
              check={check}
              onShowPage={(page) => {
                setView("reader");
                setSelectedPage(page);
              }}
            />
            {editable ? (
              <ResizeForm
                key={shown.pageCount}
                pageCount={shown.pageCount}
                maxPages={shown.maxPages}
                onChange={send}
              />
            ) : null}
            <HistoryPanel events={map.events} />
          </div>
        </div>
      </div>
      <DragOverlay>
        {drag ? (
          <div className="rounded-md border border-teal bg-paper px-3 py-2 text-sm font-semibold shadow-lg">
            {title(drag.pieceId)}
          </div>
        ) : null}
      </DragOverlay>
      {dialog && dialogPiece ? (
        <PlaceDialog
          mode={dialog.mode}
          piece={dialogPiece}
          state={map.state}
          onConfirm={send}
          onClose={() => setDialog(null)}
        />
      ) : null}
    </DndContext>
  );
}
