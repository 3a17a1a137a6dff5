import type { ComponentProps, ReactNode } from "react";

/** A labelled form control with its hint and error, wired for screen readers. */
export function Field({
  id,
  label,
  hint,
  error,
  children,
  className = "",
}: {
  id: string;
  label: string;
  hint?: string;
  error?: string;
  children: ReactNode;
  className?: string;
}) {
  return (
    <div className={`flex flex-col gap-1 ${className}`}>
      <label htmlFor={id} className="text-sm font-semibold">
        {label}
      </label>
      {children}
      {hint && !error ? (
        <p id={`${id}-hint`} className="text-xs text-ink-faint">
          {hint}
        </p>
      ) : null}
      {error ? (
        <p
          id={`${id}-error`}
          data-testid={`error-${id}`}
          className="text-xs font-semibold text-persimmon-dark"
        >
          {error}
        </p>
      ) : null}
    </div>
  );
}

export const inputClass =
  "rounded-md border border-ink/25 bg-white/70 px-3 py-2 text-sm shadow-inner shadow-ink/5 focus:border-teal aria-[invalid=true]:border-persimmon";

/** Props that tie an input to its Field's hint and error. */
export function describedBy(id: string, error?: string) {
  return {
    id,
    "aria-invalid": error ? true : undefined,
    "aria-describedby": error ? `${id}-error` : `${id}-hint`,
  } as const;
}

type TextFieldProps = Omit<ComponentProps<"input">, "id" | "className"> & {
  id: string;
  label: string;
  hint?: string;
  error?: string;
  /** Classes for the wrapper (grid placement); the input keeps Quireline's style. */
  fieldClassName?: string;
};

/** A labelled text input: Field plus an input wired to its hint and error; takes react-hook-form's register(). */
export function TextField({ id, label, hint, error, fieldClassName, ...input }: TextFieldProps) {
  return (
    <Field id={id} label={label} hint={hint} error={error} className={fieldClassName}>
      <input {...input} {...describedBy(id, error)} className={inputClass} />
    </Field>
  );
}
