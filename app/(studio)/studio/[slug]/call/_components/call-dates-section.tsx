"use client";

import { useMemo } from "react";
import { useWatch } from "react-hook-form";
import { describedBy, Field, inputClass } from "@/components/ui/field";
import { formatDateTime } from "@/lib/dates";
import { isValidTimeZone, timeZonesByRegion, zonedToUtc } from "@/lib/time-zones";
import type { CallParsed } from "@/lib/validations/call";
import { useCallForm } from "./call-form-context";

/**
 * When the call opens and closes, as wall-clock times in a chosen zone. Once the page is live each
 * date's hint reads it back in full, so a wrong zone shows before the call is saved.
 */
export function CallDatesSection({
  initial,
  timeZones,
  live,
}: {
  initial: CallParsed;
  /** Zone names from the server, so the list is the same on both sides of hydration. */
  timeZones: string[];
  /** Hints are read back only once the page is live (the server's zone data may differ). */
  live: boolean;
}) {
  const { register, control, errors: e } = useCallForm();
  const [timeZone, opensAt, closesAt] = useWatch({
    control,
    name: ["timeZone", "opensAt", "closesAt"],
  });

  const zones = useMemo(() => {
    const list = timeZones.includes(initial.timeZone)
      ? timeZones
      : [initial.timeZone, ...timeZones];
    return timeZonesByRegion(list);
  }, [timeZones, initial.timeZone]);

  const when = (local: unknown) => {
    if (
      !live ||
      typeof local !== "string" ||
      typeof timeZone !== "string" ||
      !isValidTimeZone(timeZone)
    )
      return undefined;
    const result = zonedToUtc(local, timeZone);
    return result.ok ? formatDateTime(result.instant, timeZone) : undefined;
  };

  return (
    <fieldset className="grid gap-4 sm:grid-cols-2">
      <legend className="mb-2 text-xl font-semibold">Dates</legend>
      <Field
        id="opensAt"
        label="Opens"
        hint={when(opensAt) ?? "Date and time in the zone below."}
        error={e.opensAt?.message}
      >
        <input
          {...register("opensAt")}
          defaultValue={String(initial.opensAt)}
          {...describedBy("opensAt", e.opensAt?.message)}
          type="datetime-local"
          className={inputClass}
        />
      </Field>
      <Field
        id="closesAt"
        label="Closes"
        hint={when(closesAt) ?? "Work is taken until this moment."}
        error={e.closesAt?.message}
      >
        <input
          {...register("closesAt")}
          defaultValue={String(initial.closesAt)}
          {...describedBy("closesAt", e.closesAt?.message)}
          type="datetime-local"
          className={inputClass}
        />
      </Field>
      <Field
        id="timeZone"
        label="Time zone"
        hint="The dates are in this zone, and the public page shows them in it."
        className="sm:col-span-2"
        error={e.timeZone?.message}
      >
        <select
          {...register("timeZone")}
          defaultValue={String(initial.timeZone)}
          {...describedBy("timeZone", e.timeZone?.message)}
          className={`${inputClass} bg-white`}
        >
          {zones.map((group) => (
            <optgroup key={group.region} label={group.region}>
              {group.zones.map((zone) => (
                <option key={zone} value={zone}>
                  {zone.replace(/_/g, " ")}
                </option>
              ))}
            </optgroup>
          ))}
        </select>
      </Field>
    </fieldset>
  );
}
