import Link from "next/link";
import { connection } from "next/server";
import demoAccounts from "@/db/demo-accounts.json";
import { listOpenCalls } from "@/db/queries/open-call";
import { linkButtonClass } from "@/components/ui/button";
import { ROLE_LABELS, type Role } from "@/lib/domain";
import { formatDate } from "@/lib/dates";
import { possessive } from "@/lib/possessive";

const STEPS = [
  [
    "Open a call",
    "Theme, deadline, what a piece may be, the inks, the terms and a public page to share.",
  ],
  [
    "Check every file on arrival",
    "Pixel size, bleed, resolution at print size and colour mode, explained with the numbers and the fix.",
  ],
  [
    "Plan the pages",
    "A page map that knows sheets, spreads and creep, and groups pieces by ink to save drum passes.",
  ],
  [
    "Print and finish",
    "Imposed print files, sheet and cost counts, print-shop comparison and finishing in batches.",
  ],
  [
    "Credit and pay",
    "Approved credit lines, contributor copies and exact-cent payouts from the same records.",
  ],
] as const;

/** Calls taking work now (or soon); the landing page still renders when the database is away. */
async function openCalls() {
  await connection();
  const now = new Date();
  try {
    const calls = await listOpenCalls(now);
    return calls.map((call) => ({ ...call, upcoming: call.opensAt.getTime() > now.getTime() }));
  } catch (error) {
    console.error("landing: could not list open calls", error);
    return [];
  }
}

export default async function Landing() {
  const calls = await openCalls();
  return (
    <div className="flex flex-col gap-14">
      <section className="grid items-center gap-10 md:grid-cols-[3fr_2fr]">
        <div>
          <h1 className="text-4xl font-extrabold leading-tight sm:text-5xl">
            Gather the work, fold the booklet, pay everyone to the cent.
          </h1>
          <p className="mt-5 max-w-xl text-lg text-ink-soft">
            Quireline runs a collaborative zine or small-press anthology from the open call to the
            last contributor payout: spec checks on every upload, a page map that knows how sheets
            fold, print and finishing plans, and credits tied to the same records.
          </p>
          <div className="mt-7 flex flex-wrap gap-3">
            <Link href="/sign-up" className={linkButtonClass("accent")}>
              Start an anthology
            </Link>
            <Link href="/sign-in" className={linkButtonClass("quiet")}>
              Sign in
            </Link>
          </div>
        </div>
        <BookletSketch />
      </section>

      <section aria-labelledby="how" className="grid gap-4 sm:grid-cols-2 lg:grid-cols-5">
        <h2 id="how" className="sr-only">
          What Quireline carries
        </h2>
        {STEPS.map(([title, text], n) => (
          <div key={title} className="rounded-lg border border-ink/10 bg-white/50 p-4">
            <p className="font-mono text-xs text-persimmon-dark">
              {String(n + 1).padStart(2, "0")}
            </p>
            <h3 className="mt-1 text-lg font-semibold">{title}</h3>
            <p className="mt-2 text-sm text-ink-soft">{text}</p>
          </div>
        ))}
      </section>

      <section
        className="rounded-lg border border-dashed border-ink/30 p-6"
        data-testid="demo-accounts"
      >
        <h2 className="text-2xl font-semibold">Try the demo</h2>
        <p className="mt-2 text-sm text-ink-soft">
          The Marrowbend Print Collective is putting together <em>Low Tide Almanac</em>, a
          half-letter anthology printed on a two-drum stencil duplicator. Sign in as any of its
          people:
        </p>
        {calls.length > 0 ? (
          <div className="mt-4" data-testid="open-calls">
            <h3 className="text-base font-semibold">Open calls</h3>
            <ul className="mt-1 flex flex-col gap-1 text-sm">
              {calls.map((call) => (
                <li key={call.slug}>
                  <Link href={`/calls/${call.slug}`} className="font-semibold text-teal-dark">
                    {possessive(call.title)} open call
                  </Link>{" "}
                  <span className="text-ink-soft">
                    &ldquo;{call.theme}&rdquo;,{" "}
                    {call.upcoming
                      ? `opens ${formatDate(call.opensAt, call.timeZone)}`
                      : `closes ${formatDate(call.closesAt, call.timeZone)}`}
                  </span>
                </li>
              ))}
            </ul>
          </div>
        ) : null}
        {/* On a phone the four columns do not fit: each person becomes a short card instead. */}
        <ul className="mt-4 flex flex-col gap-2 text-sm sm:hidden" data-testid="demo-account-cards">
          {demoAccounts.map((a) => (
            <li key={a.email} className="border-t border-ink/10 pt-2">
              <p>
                <span className="font-semibold">{a.name}</span>{" "}
                <span className="text-ink-soft">· {ROLE_LABELS[a.role as Role]}</span>
              </p>
              <dl className="grid grid-cols-[auto_1fr] gap-x-2 font-mono text-xs">
                <dt className="font-sans text-ink-faint">E-mail</dt>
                <dd className="break-all">{a.email}</dd>
                <dt className="font-sans text-ink-faint">Password</dt>
                <dd className="break-all">{a.password}</dd>
              </dl>
            </li>
          ))}
        </ul>
        <table className="mt-4 hidden w-full text-left text-sm sm:table">
          <thead className="text-ink-faint">
            <tr>
              <th className="py-1 font-normal">Who</th>
              <th className="py-1 font-normal">Role</th>
              <th className="py-1 font-normal">E-mail</th>
              <th className="py-1 font-normal">Password</th>
            </tr>
          </thead>
          <tbody className="font-mono">
            {demoAccounts.map((a) => (
              <tr key={a.email} className="border-t border-ink/10">
                <td className="py-1 font-sans">{a.name}</td>
                <td className="py-1 font-sans">{ROLE_LABELS[a.role as Role]}</td>
                <td className="py-1">{a.email}</td>
                <td className="py-1">{a.password}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </section>
    </div>
  );
}

/** A folded sheet opened flat: two pages, the stitch line, and the trim, bleed and safe lines. */
function BookletSketch() {
  return (
    <svg
      viewBox="0 0 320 220"
      className="w-full drop-shadow-md"
      role="img"
      aria-label="An open booklet spread with trim, bleed and safe-area lines"
    >
      <rect
        x="10"
        y="10"
        width="300"
        height="200"
        fill="#fdfaf3"
        stroke="#2a6f6b"
        strokeDasharray="4 3"
      />
      <rect x="20" y="20" width="280" height="180" fill="#fffdf8" stroke="#c8553d" />
      <rect
        x="34"
        y="34"
        width="112"
        height="152"
        fill="none"
        stroke="#d9a441"
        strokeDasharray="2 3"
      />
      <rect
        x="174"
        y="34"
        width="112"
        height="152"
        fill="none"
        stroke="#d9a441"
        strokeDasharray="2 3"
      />
      <line
        x1="160"
        y1="20"
        x2="160"
        y2="200"
        stroke="#1f2a24"
        strokeDasharray="6 5"
        strokeWidth="1.5"
      />
      <circle cx="160" cy="70" r="3" fill="#1f2a24" />
      <circle cx="160" cy="150" r="3" fill="#1f2a24" />
      <path d="M46 160 Q80 60 130 150" stroke="#2a6f6b" strokeWidth="6" fill="none" />
      <rect x="186" y="48" width="86" height="54" fill="#c8553d" opacity="0.8" />
      <rect x="186" y="112" width="86" height="6" fill="#1f2a24" />
      <rect x="186" y="124" width="60" height="6" fill="#1f2a24" />
    </svg>
  );
}
