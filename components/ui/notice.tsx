import type { ReactNode } from "react";

const TONES = {
  info: "border-teal/40 bg-teal-light/60",
  warn: "border-mustard bg-mustard-light/70",
  error: "border-persimmon/50 bg-persimmon-light/60",
  caution: "border-ink/30 bg-paper-deep",
} as const;

/** A boxed message; `testId` gives tests a handle that does not collide with Next's route announcer. */
export function Notice({
  tone = "info",
  title,
  children,
  testId,
}: {
  tone?: keyof typeof TONES;
  title?: string;
  children: ReactNode;
  testId?: string;
}) {
  return (
    <div data-testid={testId} className={`rounded-md border px-4 py-3 text-sm ${TONES[tone]}`}>
      {title ? <p className="mb-1 font-semibold">{title}</p> : null}
      <div>{children}</div>
    </div>
  );
}
