/**
 * How a person is named on screens and in answers. A name when they gave one; otherwise their
 * e-mail address, but only to viewers whose role may see contributors' private data (the
 * `contributors:private-data` action in lib/auth/policy.ts); everyone else reads a neutral label.
 * Accounts made by e-mail link have no name until their owner adds one.
 */
export interface NamedPerson {
  name: string | null;
  email: string | null;
}

export const UNNAMED_CONTRIBUTOR = "Unnamed contributor";

export function personLabel(
  person: NamedPerson,
  { mayShowEmail, unnamed = UNNAMED_CONTRIBUTOR }: { mayShowEmail: boolean; unnamed?: string },
): string {
  const name = person.name?.trim() ?? "";
  const email = person.email?.trim() ?? "";
  // A name that is the address itself is no safer to show than the address.
  const nameIsEmail = name !== "" && email !== "" && name.toLowerCase() === email.toLowerCase();
  if (name !== "" && (!nameIsEmail || mayShowEmail)) return name;
  if (mayShowEmail && email !== "") return email;
  return unnamed;
}
