import Link from "next/link";
import { findCall } from "@/db/queries/open-call";
import { requireAnthologyAccess } from "@/server/auth/guard";
import { can } from "@/lib/auth/policy";
import { env } from "@/lib/env";
import { callPhase } from "@/lib/stages";
import { formatDateTime } from "@/lib/dates";
import { BINDING_LABELS, PRINT_METHOD_LABELS, ROLE_LABELS, STAGE_LABELS } from "@/lib/domain";
import { formatLength, formatTrim } from "@/lib/format";
import { shouldScore } from "@/lib/print/paper";

export default async function AnthologyOverview({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const { anthology: a, role } = await requireAnthologyAccess(slug, "anthology:view");
  const rows: [string, string][] = [
    ["Trim", formatTrim(a)],
    ["Bleed", formatLength(a.bleedMm)],
    ["Safe margin", formatLength(a.safeMarginMm)],
    ["Minimum resolution", `${a.minPpi} ppi at print size`],
    ["Binding", BINDING_LABELS[a.binding]],
    ["Pages", `${a.pageCountTarget} planned, at most ${a.maxPages}`],
    ["Inside paper", `${a.paperGsm} gsm, ${a.paperCaliperMm} mm thick`],
    [
      "Cover",
      a.coverStock === "self"
        ? "Self-cover (same paper)"
        : `Separate stock, ${a.coverPaperGsm} gsm`,
    ],
    ["Print method", PRINT_METHOD_LABELS[a.printMethod]],
    ["Inks", a.inks.join(", ")],
  ];
  const call = await findCall(a.id);
  const phase = callPhase(call?.publishedAt ? call : null, a.stage, new Date());
  const publicPath = `/calls/${a.slug}`;
  const heavyCover =
    a.coverStock === "separate" && a.coverPaperGsm !== null && shouldScore(a.coverPaperGsm);
  return (
    <div className="flex flex-col gap-8">
      <div>
        <p className="text-sm text-ink-soft">
          {a.pressName ?? "Anthology"} · {STAGE_LABELS[a.stage]} · you are{" "}
          {role ? ROLE_LABELS[role].toLowerCase() : "a visitor"}
        </p>
        <h1 className="text-4xl font-extrabold" data-testid="anthology-title">
          {a.title}
        </h1>
        {a.summary ? <p className="mt-2 max-w-2xl text-ink-soft">{a.summary}</p> : null}
      </div>
      <section aria-labelledby="call-title" className="max-w-2xl" data-testid="overview-call">
        <h2 id="call-title" className="mb-2 text-2xl font-semibold">
          Open call
        </h2>
        <p className="text-sm">
          {call ? (
            <>
              <strong>{call.theme}</strong> ·{" "}
              {phase === "unpublished"
                ? "not published yet"
                : phase === "upcoming"
                  ? `opens ${formatDateTime(call.opensAt, call.timeZone)}`
                  : phase === "open"
                    ? `open until ${formatDateTime(call.closesAt, call.timeZone)}`
                    : `closed on ${formatDateTime(call.closesAt, call.timeZone)}`}
            </>
          ) : (
            "No call written yet."
          )}
        </p>
        <p className="mt-2 flex flex-wrap gap-x-4 gap-y-1 text-sm">
          {can(role, "call:edit") ? (
            <Link href={`/studio/${a.slug}/call`} data-testid="edit-call-link">
              {call ? "Edit the call and its stage" : "Write the open call"}
            </Link>
          ) : null}
          {phase !== "unpublished" ? (
            <span>
              Public page:{" "}
              <Link href={publicPath} className="font-mono" data-testid="overview-public-link">
                {new URL(publicPath, env().AUTH_URL).href}
              </Link>
            </span>
          ) : null}
        </p>
      </section>
      <section aria-labelledby="spec-title" className="max-w-2xl">
        <h2 id="spec-title" className="mb-3 text-2xl font-semibold">
          Print spec
        </h2>
        <dl
          className="grid grid-cols-[12rem_1fr] gap-x-4 gap-y-2 text-sm"
          data-testid="spec-summary"
        >
          {rows.map(([label, value]) => (
            <div key={label} className="contents">
              <dt className="text-ink-soft">{label}</dt>
              <dd className="font-mono">{value}</dd>
            </div>
          ))}
        </dl>
        {heavyCover ? (
          <p className="mt-4 text-sm text-ink-soft">
            The cover stock is heavy enough that it should be scored before folding so it does not
            crack.
          </p>
        ) : null}
      </section>
    </div>
  );
}
