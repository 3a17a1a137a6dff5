"use client";

import { zodResolver } from "@hookform/resolvers/zod";
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import { useForm } from "react-hook-form";
import { Button } from "@/components/ui/button";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { Notice } from "@/components/ui/notice";
import { formatDateTime } from "@/lib/dates";
import { editorNoteSchema, type EditorNoteInput } from "@/lib/validations/review";
import { ApiError, fetchJson } from "@/components/api/fetch-json";
import type { NoteAddedAnswer, NotesAnswer } from "@/lib/wire/review";

/** The editors' private notes on a piece: newest first, with a form to add one. */
export function EditorNotes({ pieceId }: { pieceId: number }) {
  const queryClient = useQueryClient();
  const queryKey = ["piece-notes", pieceId];
  const notes = useQuery({
    queryKey,
    queryFn: ({ signal }) => fetchJson<NotesAnswer>(`/api/pieces/${pieceId}/notes`, { signal }),
  });
  const { register, handleSubmit, reset, setError, formState } = useForm<EditorNoteInput>({
    resolver: zodResolver(editorNoteSchema),
    defaultValues: { body: "" },
  });
  const add = useMutation({
    mutationFn: (values: EditorNoteInput) =>
      fetchJson<NoteAddedAnswer>(`/api/pieces/${pieceId}/notes`, { method: "POST", json: values }),
    onSuccess: ({ note }) => {
      queryClient.setQueryData<NotesAnswer>(queryKey, (old) => ({
        notes: [note, ...(old?.notes ?? [])],
      }));
      reset({ body: "" });
    },
    onError: (error) => {
      const message = error instanceof ApiError ? error.fieldMessage("body") : undefined;
      if (message) setError("body", { message });
    },
  });
  const onSubmit = handleSubmit((values) => add.mutateAsync(values).catch(() => undefined));
  const bodyError = formState.errors.body?.message;

  return (
    <div className="flex flex-col gap-4">
      <form onSubmit={onSubmit} noValidate className="flex flex-col gap-2">
        <Field id="note-body" label="Add a note" error={bodyError}>
          <textarea
            {...register("body")}
            {...describedBy("note-body", bodyError)}
            rows={3}
            maxLength={4000}
            className={inputClass}
          />
        </Field>
        <Button type="submit" variant="quiet" busy={add.isPending} className="self-start">
          {add.isPending ? "Saving…" : "Save note"}
        </Button>
        {add.isError && !bodyError ? (
          <Notice tone="error" testId="note-error">
            {add.error.message} Your note is still in the box.
          </Notice>
        ) : null}
      </form>

      {notes.isPending ? (
        <ul className="flex flex-col gap-2" aria-busy="true" aria-label="Loading notes">
          {[0, 1].map((i) => (
            <li key={i} className="h-12 animate-pulse rounded bg-ink/10" />
          ))}
        </ul>
      ) : notes.isError ? (
        <Notice tone="error" testId="notes-error" title="The notes could not be loaded">
          <p>{notes.error.message}</p>
          <Button
            type="button"
            variant="quiet"
            className="mt-2"
            onClick={() => void notes.refetch()}
            busy={notes.isFetching}
          >
            Try again
          </Button>
        </Notice>
      ) : notes.data.notes.length === 0 ? (
        <p className="text-sm text-ink-soft" data-testid="notes-empty">
          No notes yet.
        </p>
      ) : (
        <ul className="flex flex-col gap-3" data-testid="notes">
          {notes.data.notes.map((note) => (
            <li
              key={note.id}
              className="rounded-md border border-ink/15 bg-white/50 px-3 py-2 text-sm"
            >
              <p className="whitespace-pre-line">{note.body}</p>
              <p className="mt-1 text-xs text-ink-soft">
                {note.author.name ?? "An editor"} ·{" "}
                <time dateTime={note.createdAt}>{formatDateTime(new Date(note.createdAt))}</time>
              </p>
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
