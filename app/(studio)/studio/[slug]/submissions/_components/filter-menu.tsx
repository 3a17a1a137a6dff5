"use client";

import { useRef } from "react";

/**
 * A disclosure holding a group of checkboxes (a multi-value filter or the column list). Native
 * <details>: Enter or Space opens it, Escape closes it and returns focus to its button.
 */
export function CheckboxMenu<T extends string>({
  id,
  label,
  legend,
  options,
  checked,
  onToggle,
  onClear,
}: {
  id: string;
  label: string;
  legend: string;
  options: { value: T; label: string }[];
  checked: readonly T[];
  onToggle: (value: T, on: boolean) => void;
  onClear?: () => void;
}) {
  const details = useRef<HTMLDetailsElement>(null);
  const close = () => {
    if (!details.current) return;
    details.current.open = false;
    details.current.querySelector("summary")?.focus();
  };
  return (
    <details
      ref={details}
      className="relative"
      data-testid={id}
      onKeyDown={(event) => {
        if (event.key === "Escape") close();
      }}
    >
      <summary className="cursor-pointer list-none rounded-md border border-ink/30 bg-white/70 px-3 py-2 text-sm font-semibold hover:border-ink">
        {label}
        {checked.length ? (
          <span className="ml-1 rounded-full bg-ink px-1.5 text-xs text-paper">
            {checked.length}
          </span>
        ) : null}
        <span aria-hidden="true" className="ml-1 text-ink-faint">
          ▾
        </span>
      </summary>
      <fieldset className="absolute left-0 z-20 mt-1 flex min-w-56 flex-col gap-1 rounded-md border border-ink/20 bg-paper p-3 shadow-lg">
        <legend className="sr-only">{legend}</legend>
        {options.map((option) => {
          const inputId = `${id}-${option.value}`;
          return (
            <label
              key={option.value}
              htmlFor={inputId}
              className="flex cursor-pointer items-center gap-2 rounded px-1 py-0.5 text-sm hover:bg-paper-deep"
            >
              <input
                id={inputId}
                type="checkbox"
                className="h-4 w-4 accent-teal"
                checked={checked.includes(option.value)}
                onChange={(event) => onToggle(option.value, event.target.checked)}
              />
              {option.label}
            </label>
          );
        })}
        {onClear && checked.length ? (
          <button
            type="button"
            onClick={onClear}
            className="mt-1 self-start text-xs font-semibold underline"
          >
            Clear
          </button>
        ) : null}
      </fieldset>
    </details>
  );
}
