import Link from "next/link";

export default function Forbidden() {
  return (
    <section className="mx-auto max-w-xl py-16 text-center" data-testid="forbidden">
      <p className="font-mono text-sm text-persimmon-dark">403</p>
      <h1 className="mt-2 text-3xl font-extrabold">This page is for another role</h1>
      <p className="mt-4 text-ink-soft">
        You are signed in, but your role in this anthology does not open this page. If you think it
        should, ask the anthology&apos;s lead editor to change your role.
      </p>
      <Link href="/studio" className="mt-6 inline-block font-semibold">
        Back to your anthologies
      </Link>
    </section>
  );
}
