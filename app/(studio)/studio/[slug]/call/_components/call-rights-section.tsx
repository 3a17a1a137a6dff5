"use client";

import { describedBy, Field, inputClass } from "@/components/ui/field";
import type { CallParsed } from "@/lib/validations/call";
import { useCallForm } from "./call-form-context";

/** The rights the press asks contributors for. */
export function CallRightsSection({ initial }: { initial: CallParsed }) {
  const { register, errors: e } = useCallForm();
  return (
    <fieldset className="grid gap-4">
      <legend className="mb-2 text-xl font-semibold">Rights</legend>
      <Field
        id="rightsAsked"
        label="Rights you ask for"
        hint="Which rights, for how long, and when they return to the contributor."
        error={e.rightsAsked?.message}
      >
        <textarea
          {...register("rightsAsked")}
          defaultValue={String(initial.rightsAsked)}
          {...describedBy("rightsAsked", e.rightsAsked?.message)}
          rows={3}
          className={inputClass}
        />
      </Field>
    </fieldset>
  );
}
