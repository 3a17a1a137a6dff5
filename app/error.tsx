"use client";

export default function ErrorPage({ reset }: { error: Error; reset: () => void }) {
  return (
    <section className="mx-auto max-w-xl py-16 text-center">
      <h1 className="text-3xl font-extrabold">Something tore</h1>
      <p className="mt-4 text-ink-soft">
        The page hit an error on our side. Nothing you entered was half-saved.
      </p>
      <button
        type="button"
        onClick={reset}
        className="mt-6 rounded-md bg-ink px-4 py-2 font-semibold text-paper"
      >
        Try again
      </button>
    </section>
  );
}
