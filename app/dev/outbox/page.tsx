import { headers } from "next/headers";
import { notFound } from "next/navigation";
import { env } from "@/lib/env";
import { mailFor, outboxServed } from "@/lib/outbox";
import { requireUser } from "@/server/auth/guard";

export const dynamic = "force-dynamic";
export const metadata = { title: "Outbox (local mail sink)" };

type SinkMessage = {
  id: string;
  from: string;
  to: string[];
  subject: string;
  text: string;
  date: string;
};

/**
 * The signed-in person's own mail, as the local SMTP sink caught it. Exists only while the sink is
 * configured (OUTBOX_URL) and the app listens on, and is reached by, loopback (lib/outbox.ts).
 */
export default async function OutboxPage() {
  const outbox = env().OUTBOX_URL;
  const served = outboxServed({
    outboxUrl: outbox,
    bindHost: env().APP_BIND_HOST,
    requestHost: (await headers()).get("host"),
  });
  if (!outbox || !served) notFound();
  const user = await requireUser("/dev/outbox");
  if (!user.email) notFound();
  let messages: SinkMessage[] = [];
  let problem: string | undefined;
  try {
    const url = `${outbox.replace(/\/$/, "")}/messages?to=${encodeURIComponent(user.email)}`;
    const response = await fetch(url, { cache: "no-store" });
    messages = mailFor((await response.json()) as SinkMessage[], user.email).reverse();
  } catch {
    problem = `The mail sink at ${outbox} is not answering.`;
  }
  return (
    <div className="flex flex-col gap-6">
      <div>
        <h1 className="text-3xl font-extrabold">Outbox</h1>
        <p className="text-ink-soft">
          Mail Quireline sent to <span className="font-mono">{user.email}</span> while running
          locally, caught by the SMTP sink instead of being delivered. Newest first. Only your own
          mail is shown here, and only on this machine.
        </p>
      </div>
      {problem ? <p className="text-persimmon-dark">{problem}</p> : null}
      {messages.length === 0 && !problem ? <p data-testid="outbox-empty">No mail yet.</p> : null}
      <ul className="flex flex-col gap-4">
        {messages.map((m) => (
          <li
            key={m.id}
            className="rounded-lg border border-ink/10 bg-white/60 p-4"
            data-testid="outbox-message"
          >
            <p className="text-xs text-ink-faint">
              {new Date(m.date).toISOString().replace("T", " ").slice(0, 19)} UTC · to{" "}
              {m.to.join(", ")}
            </p>
            <p className="font-semibold">{m.subject}</p>
            <pre className="mt-2 whitespace-pre-wrap break-words font-mono text-xs">{m.text}</pre>
          </li>
        ))}
      </ul>
    </div>
  );
}
