/** Quireline's name mark: an open folded sheet with its stitch line, then the name. */
export function Logo({ className = "" }: { className?: string }) {
  return (
    <span className={`inline-flex items-center gap-2 ${className}`}>
      <svg viewBox="0 0 64 64" className="h-8 w-8" aria-hidden="true">
        <rect width="64" height="64" rx="12" fill="#1f2a24" />
        <path d="M14 18 L32 14 L32 50 L14 54 Z" fill="#f6f1e6" />
        <path d="M32 14 L50 18 L50 54 L32 50 Z" fill="#ece4d2" />
        <path d="M32 14 L32 50" stroke="#c8553d" strokeWidth="2.5" strokeDasharray="5 4" />
        <circle cx="44" cy="45" r="4" fill="#c8553d" />
      </svg>
      <span className="font-display text-xl font-extrabold tracking-tight">Quireline</span>
    </span>
  );
}
