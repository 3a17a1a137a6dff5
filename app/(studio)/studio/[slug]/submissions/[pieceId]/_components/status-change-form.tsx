"use client";

import { useMutation } from "@tanstack/react-query";
import { useRouter } from "next/navigation";
import { useState, useTransition, type FormEvent } from "react";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { PIECE_STATUS_LABELS, type PieceStatus } from "@/lib/domain";
import { STATUSES_THAT_EMAIL } from "@/lib/pieces/status";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import type { PieceMoveAnswer } from "@/lib/wire/review";

/** Moves this piece to another status, with a message to the contributor (required to ask for a fix). */
export function StatusChangeForm({
  pieceId,
  status,
  moves,
  contributorName,
}: {
  pieceId: number;
  status: PieceStatus;
  moves: PieceStatus[];
  contributorName: string;
}) {
  const router = useRouter();
  const [refreshing, startRefresh] = useTransition();
  const [to, setTo] = useState<PieceStatus | "">("");
  const [message, setMessage] = useState("");
  const [fieldError, setFieldError] = useState<string>();
  const [done, setDone] = useState<PieceMoveAnswer>();
  const [warning, setWarning] = useState<string>();

  const mutation = useMutation({
    mutationFn: (body: {
      to: PieceStatus;
      from: PieceStatus;
      message?: string;
      confirm?: boolean;
    }) =>
      fetchJson<PieceMoveAnswer>(`/api/pieces/${pieceId}/status`, { method: "POST", json: body }),
  });

  if (moves.length === 0) {
    return (
      <p className="text-sm" data-testid="no-moves">
        The contributor withdrew this piece, so its status can no longer change.
      </p>
    );
  }

  const emails = to !== "" && STATUSES_THAT_EMAIL.includes(to);
  const needsMessage = to === "fix-requested";

  const move = async (confirm: boolean) => {
    setFieldError(undefined);
    setDone(undefined);
    setWarning(undefined);
    if (!to) return setFieldError("Choose the new status");
    if (needsMessage && !message.trim())
      return setFieldError(`Say what to fix: ${contributorName} receives this message`);
    try {
      const moved = await mutation.mutateAsync({
        to,
        from: status,
        message: message.trim() || undefined,
        confirm: confirm || undefined,
      });
      setDone(moved);
      setTo("");
      setMessage("");
      startRefresh(() => router.refresh());
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

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-3" data-testid="status-form">
      <fieldset className="flex flex-col gap-1">
        <legend className="mb-1 text-sm font-semibold">
          Move from &ldquo;{PIECE_STATUS_LABELS[status]}&rdquo; to
        </legend>
        {moves.map((move) => (
          <label key={move} className="flex cursor-pointer items-center gap-2 text-sm">
            <input
              type="radio"
              name="to"
              value={move}
              checked={to === move}
              onChange={() => setTo(move)}
              className="h-4 w-4 accent-teal"
            />
            {PIECE_STATUS_LABELS[move]}
          </label>
        ))}
      </fieldset>
      <Field
        id="status-message"
        label={
          needsMessage
            ? `What should ${contributorName} fix?`
            : `Message to ${contributorName} (optional)`
        }
        hint={
          to === ""
            ? undefined
            : emails
              ? `${contributorName} is e-mailed about this change, with your message.`
              : "This move sends no e-mail; the message stays in the history."
        }
        error={fieldError}
      >
        <textarea
          {...describedBy("status-message", fieldError)}
          value={message}
          onChange={(event) => setMessage(event.target.value)}
          rows={4}
          maxLength={2000}
          className={inputClass}
        />
      </Field>
      <Button type="submit" busy={mutation.isPending || refreshing} className="self-start">
        {mutation.isPending
          ? "Saving…"
          : to
            ? `Move to “${PIECE_STATUS_LABELS[to]}”`
            : "Change status"}
      </Button>
      {warning ? (
        <Notice tone="warn" testId="accept-warning" title="This piece may not print">
          <p>{warning}</p>
          <div className="mt-2 flex flex-wrap gap-2">
            <Button type="button" busy={mutation.isPending} onClick={() => void move(true)}>
              Accept anyway
            </Button>
            <Button type="button" variant="quiet" onClick={() => setWarning(undefined)}>
              Keep it where it is
            </Button>
          </div>
        </Notice>
      ) : null}
      {mutation.isError &&
      !warning &&
      !(mutation.error instanceof ApiError && mutation.error.body.needsConfirm === true) &&
      !(mutation.error instanceof ApiError && mutation.error.fields.message) ? (
        <Notice tone="error" testId="status-error" title="The status did not change">
          <p>{mutation.error.message}</p>
          {mutation.error instanceof ApiError && mutation.error.status === 409 ? (
            <Button
              type="button"
              variant="quiet"
              className="mt-2"
              onClick={() => startRefresh(() => router.refresh())}
            >
              Show the current status
            </Button>
          ) : null}
        </Notice>
      ) : null}
      {done ? (
        <Notice testId="status-result">
          Moved to &ldquo;{PIECE_STATUS_LABELS[done.to]}&rdquo;.
          {done.mailed === true ? ` ${contributorName} has been e-mailed.` : ""}
          {done.mailed === false
            ? " The e-mail to the contributor could not be sent; it is in the e-mail log."
            : ""}
        </Notice>
      ) : null}
    </form>
  );
}
