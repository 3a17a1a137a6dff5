import { readFileSync } from "node:fs";

type DemoAccount = { role: string; name: string; email: string; password: string };

// Read rather than imported: Playwright's loader needs import attributes for JSON modules.
const demoAccounts: DemoAccount[] = JSON.parse(
  readFileSync(new URL("../../db/demo-accounts.json", import.meta.url), "utf8"),
);

/** A demo person from db/demo-accounts.json by e-mail prefix, e.g. demoAccount("odile"). */
export function demoAccount(prefix: string): DemoAccount {
  const account = demoAccounts.find((a) => a.email.startsWith(`${prefix}@`));
  if (!account) throw new Error(`no demo account ${prefix}`);
  return account;
}

/** An address no other test uses, so tests can run in parallel against one database and outbox. */
export function uniqueEmail(label: string): string {
  return `${label}-${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 7)}@example.test`;
}
