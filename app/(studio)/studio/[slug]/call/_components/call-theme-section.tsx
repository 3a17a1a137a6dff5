"use client";

import { describedBy, Field, inputClass } from "@/components/ui/field";
import type { CallParsed } from "@/lib/validations/call";
import { useCallForm } from "./call-form-context";

/** The call's theme and brief. */
export function CallThemeSection({ initial }: { initial: CallParsed }) {
  const { register, errors: e } = useCallForm();
  return (
    <fieldset className="grid gap-4">
      <legend className="mb-2 text-xl font-semibold">The call</legend>
      <Field
        id="theme"
        label="Theme"
        hint="A few words, e.g. What the tide leaves."
        error={e.theme?.message}
      >
        <input
          {...register("theme")}
          defaultValue={String(initial.theme)}
          {...describedBy("theme", e.theme?.message)}
          className={inputClass}
        />
      </Field>
      <Field
        id="brief"
        label="Brief"
        hint="What you hope to receive, who may send it, anything contributors should know. Blank lines start new paragraphs."
        error={e.brief?.message}
      >
        <textarea
          {...register("brief")}
          defaultValue={String(initial.brief)}
          {...describedBy("brief", e.brief?.message)}
          rows={8}
          className={inputClass}
        />
      </Field>
    </fieldset>
  );
}
