import { useEffect, useRef } from "react";
import { Button } from "@/components/ui/button";
import { pagesInWords } from "@/lib/map/state";
import type { NoticesPreviewAnswer } from "@/lib/map-edits/payload";

/** Who the page notices go to and with which pages, asked before anything is sent. */
export function NoticesConfirm({
  preview,
  busy,
  onSend,
  onCancel,
}: {
  preview: NoticesPreviewAnswer;
  busy: boolean;
  onSend: () => void;
  onCancel: () => void;
}) {
  const heading = useRef<HTMLHeadingElement>(null);
  useEffect(() => heading.current?.focus(), []);
  const { contributors, toSend } = preview;
  return (
    <section
      aria-labelledby="notices-confirm-title"
      data-testid="notices-confirm"
      className="flex flex-col gap-3 rounded-md border border-ink/30 bg-paper-deep px-4 py-3 text-sm"
    >
      <h2 id="notices-confirm-title" ref={heading} tabIndex={-1} className="font-semibold">
        {contributors.length === 0
          ? "No pieces are on the map yet, so there is nobody to tell."
          : toSend === 0
            ? "Nothing new to send: everyone below already has these pages."
            : `Send ${toSend === 1 ? "1 contributor" : `${toSend} contributors`} their pages?`}
      </h2>
      {contributors.length > 0 ? (
        <ul className="flex flex-col gap-1" data-testid="notices-preview">
          {contributors.map((person, i) => (
            <li key={i} data-testid="notice-preview-entry">
              <span className="font-semibold">{person.contributorName}</span>:{" "}
              {person.pieces.map((p) => `“${p.title}” on ${pagesInWords(p.pages)}`).join("; ")}
              {person.alreadySent ? (
                <span className="text-ink-soft"> (already sent; not sent again)</span>
              ) : !person.hasAddress ? (
                <span className="text-persimmon-dark"> (no e-mail address; cannot be sent)</span>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      <p className="text-xs text-ink-soft">
        The pages may still change; a contributor whose pages change can be told again.
      </p>
      <div className="flex flex-wrap gap-2">
        {toSend > 0 ? (
          <Button type="button" onClick={onSend} busy={busy} data-testid="notices-send">
            Send {toSend === 1 ? "1 e-mail" : `${toSend} e-mails`}
          </Button>
        ) : null}
        <Button type="button" variant="quiet" onClick={onCancel} data-testid="notices-cancel">
          {toSend > 0 ? "Cancel" : "Close"}
        </Button>
      </div>
    </section>
  );
}
