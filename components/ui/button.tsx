import type { ButtonHTMLAttributes } from "react";

const VARIANTS = {
  primary: "bg-ink text-paper hover:bg-teal-dark",
  accent: "bg-persimmon text-paper hover:bg-persimmon-dark",
  quiet: "bg-transparent text-ink border border-ink/30 hover:border-ink hover:bg-paper-deep",
} as const;

type Props = ButtonHTMLAttributes<HTMLButtonElement> & {
  variant?: keyof typeof VARIANTS;
  busy?: boolean;
};

/** Quireline's button; `busy` disables it and says so to screen readers. */
export function Button({
  variant = "primary",
  busy = false,
  className = "",
  children,
  disabled,
  ...rest
}: Props) {
  return (
    <button
      {...rest}
      disabled={disabled || busy}
      aria-busy={busy || undefined}
      className={`inline-flex items-center justify-center gap-2 rounded-md px-4 py-2 text-sm font-semibold transition-colors disabled:cursor-not-allowed disabled:opacity-60 ${VARIANTS[variant]} ${className}`}
    >
      {children}
    </button>
  );
}

export const linkButtonClass = (variant: keyof typeof VARIANTS = "primary") =>
  `inline-flex items-center justify-center rounded-md px-4 py-2 text-sm font-semibold no-underline transition-colors ${VARIANTS[variant]}`;
