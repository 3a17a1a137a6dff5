"use client";

import { useMutation } from "@tanstack/react-query";
import { useId, useState, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { PIECE_STATUS_LABELS, type PieceStatus } from "@/lib/domain";
import { canMove, STATUSES_THAT_EMAIL } from "@/lib/pieces/status";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import type { BulkMoveAnswer } from "@/lib/wire/review";

/** Statuses an editor can move pieces to (withdrawing is the contributor's own act). */
const TARGETS: PieceStatus[] = [
  "awaiting-review",
  "fix-requested",
  "shortlisted",
  "accepted",
  "declined",
];

/** The bar shown while rows are selected: move them all to one status, with an optional message. */
export function BulkStatusBar({
  slug,
  selected,
  onDone,
}: {
  slug: string;
  selected: { id: number; title: string; status: PieceStatus }[];
  onDone: (changedIds: number[]) => void;
}) {
  const uid = useId();
  const [to, setTo] = useState<PieceStatus | "">("");
  const [message, setMessage] = useState("");
  const [fieldError, setFieldError] = useState<string>();
  const [answer, setAnswer] = useState<{
    answer: BulkMoveAnswer;
    to: PieceStatus;
    titles: Map<number, string>;
  }>();
  const [warning, setWarning] = useState<string>();

  const mutation = useMutation({
    mutationFn: (body: {
      pieceIds: number[];
      to: PieceStatus;
      message?: string;
      confirm?: boolean;
    }) =>
      fetchJson<BulkMoveAnswer>(`/api/anthologies/${slug}/submissions/status`, {
        method: "POST",
        json: body,
      }),
  });

  const movable = to ? selected.filter((s) => canMove(s.status, to, "editor")).length : 0;
  const needsMessage = to === "fix-requested";
  const emails = to !== "" && STATUSES_THAT_EMAIL.includes(to);

  const move = async (confirm: boolean) => {
    setFieldError(undefined);
    setWarning(undefined);
    if (!to) return setFieldError("Choose where to move them");
    if (needsMessage && !message.trim())
      return setFieldError("Say what to fix: the contributors receive this message");
    const titles = new Map(selected.map((s) => [s.id, s.title]));
    try {
      const result = await mutation.mutateAsync({
        pieceIds: selected.map((s) => s.id),
        to,
        message: message.trim() || undefined,
        confirm: confirm || undefined,
      });
      setAnswer({ answer: result, to, titles });
      if (result.changed.length) setMessage("");
      onDone(result.changed.map((c) => c.pieceId));
    } catch (error) {
      if (error instanceof ApiError && error.body.needsConfirm === true)
        setWarning(String(error.body.warning ?? error.message));
      else if (error instanceof ApiError && error.fieldMessage("message"))
        setFieldError(error.fieldMessage("message"));
    }
  };

  const submit = (event: FormEvent) => {
    event.preventDefault();
    void move(false);
  };

  const messageId = `${uid}-message`;
  return (
    <div className="flex flex-col gap-3">
      {selected.length > 0 ? (
        <form
          onSubmit={submit}
          noValidate
          className="flex flex-wrap items-end gap-3 rounded-md border border-ink/20 bg-paper-deep px-4 py-3"
          data-testid="bulk-bar"
          aria-label="Change the status of the selected pieces"
        >
          <p className="self-center text-sm font-semibold" aria-live="polite">
            {selected.length} selected
          </p>
          <Field id={`${uid}-to`} label="Move to">
            <select
              {...describedBy(`${uid}-to`)}
              value={to}
              onChange={(event) => setTo(event.target.value as PieceStatus | "")}
              className={`${inputClass} bg-white`}
            >
              <option value="">Choose a status…</option>
              {TARGETS.map((status) => (
                <option key={status} value={status}>
                  {PIECE_STATUS_LABELS[status]}
                </option>
              ))}
            </select>
          </Field>
          <Field
            id={messageId}
            label={
              needsMessage
                ? "What to fix (sent to each contributor)"
                : "Message to the contributors (optional)"
            }
            hint={
              to === ""
                ? undefined
                : emails
                  ? "Each contributor is e-mailed about the change."
                  : "This move sends no e-mail; the message stays in the history."
            }
            error={fieldError}
            className="min-w-72 flex-1"
          >
            <textarea
              {...describedBy(messageId, fieldError)}
              value={message}
              onChange={(event) => setMessage(event.target.value)}
              rows={2}
              maxLength={2000}
              className={inputClass}
            />
          </Field>
          <div className="flex flex-col gap-1">
            <Button type="submit" busy={mutation.isPending}>
              {mutation.isPending ? "Moving…" : "Apply"}
            </Button>
            {to ? (
              <span className="text-xs text-ink-soft">
                {movable} of {selected.length} can move there
              </span>
            ) : null}
          </div>
        </form>
      ) : null}
      {warning && selected.length > 0 ? (
        <Notice tone="warn" testId="bulk-accept-warning" title="Some pieces may not print">
          <p>{warning}</p>
          <div className="mt-2 flex flex-wrap gap-2">
            <Button type="button" busy={mutation.isPending} onClick={() => void move(true)}>
              Accept anyway
            </Button>
            <Button type="button" variant="quiet" onClick={() => setWarning(undefined)}>
              Keep them where they are
            </Button>
          </div>
        </Notice>
      ) : null}
      {mutation.isError &&
      !warning &&
      !(mutation.error instanceof ApiError && mutation.error.body.needsConfirm === true) &&
      !(mutation.error instanceof ApiError && mutation.error.fields.message) ? (
        <Notice tone="error" testId="bulk-error" title="Nothing was moved">
          {mutation.error.message} Your selection and message are kept; try again.
        </Notice>
      ) : null}
      {answer ? <BulkResult {...answer} onDismiss={() => setAnswer(undefined)} /> : null}
    </div>
  );
}

function BulkResult({
  answer,
  to,
  titles,
  onDismiss,
}: {
  answer: BulkMoveAnswer;
  to: PieceStatus;
  titles: Map<number, string>;
  onDismiss: () => void;
}) {
  const mailed = answer.changed.filter((c) => c.mailed).length;
  const unmailed = answer.changed.filter((c) => c.mailed === false).length;
  const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;
  return (
    <Notice tone={answer.refused.length ? "warn" : "info"} testId="bulk-result">
      <div className="flex items-start justify-between gap-4">
        <div>
          <p>
            {answer.changed.length
              ? `Moved ${plural(answer.changed.length, "piece")} to "${PIECE_STATUS_LABELS[to]}".`
              : "No piece was moved."}
            {mailed ? ` E-mailed ${plural(mailed, "contributor")}.` : ""}
            {unmailed
              ? ` ${plural(unmailed, "e-mail")} could not be sent; see the e-mail log.`
              : ""}
          </p>
          {answer.refused.length ? (
            <ul className="mt-2 list-disc pl-5" data-testid="bulk-refused">
              {answer.refused.map((r) => (
                <li key={r.pieceId}>
                  <strong>{titles.get(r.pieceId) ?? `Piece ${r.pieceId}`}</strong> stayed where it
                  was: {r.reason}
                </li>
              ))}
            </ul>
          ) : null}
        </div>
        <button type="button" onClick={onDismiss} className="text-xs font-semibold underline">
          Dismiss
        </button>
      </div>
    </Notice>
  );
}
