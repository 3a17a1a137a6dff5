import Link from "next/link";

export default function NotFound() {
  return (
    <section className="mx-auto max-w-xl py-16 text-center" data-testid="not-found">
      <p className="font-mono text-sm text-persimmon-dark">404</p>
      <h1 className="mt-2 text-3xl font-extrabold">Nothing is printed on this page</h1>
      <p className="mt-4 text-ink-soft">
        The address may be mistyped, or the anthology was renamed or removed.
      </p>
      <Link href="/" className="mt-6 inline-block font-semibold">
        Go to the front page
      </Link>
    </section>
  );
}
