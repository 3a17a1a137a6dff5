"use client";

import { Controller, type Control } from "react-hook-form";
import type { CallInput, CallParsed } from "@/lib/validations/call";

/** A group of checkboxes editing one list of strings; keyboard and screen-reader friendly. */
export function CheckboxGroup({
  control,
  name,
  label,
  hint,
  options,
  error,
}: {
  control: Control<CallInput, unknown, CallParsed>;
  name: "allowedKinds" | "allowedInks";
  label: string;
  hint?: string;
  options: { value: string; label: string }[];
  error?: string;
}) {
  const groupId = `${name}-group`;
  return (
    <Controller
      control={control}
      name={name}
      render={({ field }) => {
        const selected = (Array.isArray(field.value) ? field.value : []) as string[];
        const toggle = (value: string, on: boolean) => {
          const next = on ? [...selected, value] : selected.filter((v) => v !== value);
          // Keep the options' order so saved lists read the same way every time.
          field.onChange(options.map((o) => o.value).filter((v) => next.includes(v)));
        };
        return (
          <div
            role="group"
            aria-labelledby={`${groupId}-label`}
            aria-describedby={error ? `${name}-error` : undefined}
            className="flex flex-col gap-1"
          >
            <p id={`${groupId}-label`} className="text-sm font-semibold">
              {label}
            </p>
            <div className="flex flex-wrap gap-x-4 gap-y-1">
              {options.map((option) => (
                <label key={option.value} className="flex items-center gap-2 text-sm">
                  <input
                    type="checkbox"
                    name={name}
                    value={option.value}
                    checked={selected.includes(option.value)}
                    onChange={(event) => toggle(option.value, event.target.checked)}
                    onBlur={field.onBlur}
                    className="h-4 w-4 accent-teal"
                  />
                  {option.label}
                </label>
              ))}
            </div>
            {hint && !error ? <p className="text-xs text-ink-faint">{hint}</p> : null}
            {error ? (
              <p
                id={`${name}-error`}
                data-testid={`error-${name}`}
                className="text-xs font-semibold text-persimmon-dark"
              >
                {error}
              </p>
            ) : null}
          </div>
        );
      }}
    />
  );
}
