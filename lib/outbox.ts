/**
 * When the local mail sink's outbox page may be shown. It holds sign-in and invitation links, so
 * it is served only while the app listens on loopback and is reached by a loopback name, only to
 * a signed-in person, and only with mail addressed to them.
 */

/** True for names and addresses that stay on this machine (RFC 6761 §6.3 "localhost"; 127.0.0.0/8; ::1). */
export function isLoopbackHost(host: string | null | undefined): boolean {
  if (!host) return false;
  let name = host.trim().toLowerCase();
  if (name.startsWith("[")) name = name.slice(1, name.indexOf("]"));
  else if (name.split(":").length === 2) name = name.split(":")[0]!;
  if (name === "localhost" || name.endsWith(".localhost")) return true;
  if (name === "::1") return true;
  return /^127(?:\.(?:25[0-5]|2[0-4]\d|1?\d?\d)){3}$/.test(name);
}

export interface OutboxFacts {
  outboxUrl: string | undefined;
  /** The address the server listens on. */
  bindHost: string | undefined;
  /** The Host header the page was asked for with. */
  requestHost: string | null;
}

/** Whether the outbox page exists at all for this request. */
export function outboxServed(facts: OutboxFacts): boolean {
  return (
    Boolean(facts.outboxUrl) && isLoopbackHost(facts.bindHost) && isLoopbackHost(facts.requestHost)
  );
}

/** Only the messages addressed to `email` (compared without case). */
export function mailFor<M extends { to: string[] }>(messages: M[], email: string): M[] {
  const wanted = email.trim().toLowerCase();
  return messages.filter((m) => m.to.some((a) => a.trim().toLowerCase() === wanted));
}
