"use client";

import { useWatch } from "react-hook-form";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { PIECE_KIND_LABELS, PIECE_KINDS } from "@/lib/domain";
import type { CallParsed } from "@/lib/validations/call";
import { CheckboxGroup } from "./checkbox-group";
import { useCallForm } from "./call-form-context";

/** What a piece may be: its kinds, its inks (from the anthology's), a run's length, how many a person sends. */
export function PieceRulesSection({
  initial,
  anthologyInks,
  maxPages,
}: {
  initial: CallParsed;
  anthologyInks: string[];
  maxPages: number;
}) {
  const { register, control, errors: e } = useCallForm();
  const kinds = useWatch({ control, name: "allowedKinds" });
  return (
    <fieldset className="grid gap-4 sm:grid-cols-2">
      <legend className="mb-2 text-xl font-semibold">What a piece may be</legend>
      <CheckboxGroup
        control={control}
        name="allowedKinds"
        label="Kinds of piece"
        options={PIECE_KINDS.map((kind) => ({ value: kind, label: PIECE_KIND_LABELS[kind] }))}
        error={e.allowedKinds?.message ?? e.allowedKinds?.root?.message}
      />
      <CheckboxGroup
        control={control}
        name="allowedInks"
        label="Inks a piece may use"
        hint="From the anthology's inks."
        options={anthologyInks.map((ink) => ({ value: ink, label: ink }))}
        error={e.allowedInks?.message ?? e.allowedInks?.root?.message}
      />
      {Array.isArray(kinds) && kinds.includes("run") ? (
        <Field
          id="maxRunPages"
          label="Longest run (pages)"
          hint={`A run is 2 or more pages in a row; the booklet has at most ${maxPages}.`}
          error={e.maxRunPages?.message}
        >
          <input
            {...register("maxRunPages")}
            defaultValue={String(initial.maxRunPages)}
            {...describedBy("maxRunPages", e.maxRunPages?.message)}
            inputMode="numeric"
            className={inputClass}
          />
        </Field>
      ) : null}
      <Field id="piecesPerPerson" label="Pieces per person" error={e.piecesPerPerson?.message}>
        <input
          {...register("piecesPerPerson")}
          defaultValue={String(initial.piecesPerPerson)}
          {...describedBy("piecesPerPerson", e.piecesPerPerson?.message)}
          inputMode="numeric"
          className={inputClass}
        />
      </Field>
    </fieldset>
  );
}
