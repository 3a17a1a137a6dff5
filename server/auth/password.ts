import "server-only";
import { hash, verify } from "@node-rs/argon2";

// argon2id with the OWASP cheat-sheet minimum (m=19 MiB, t=2, p=1) — value from memory.
const OPTIONS = { memoryCost: 19456, timeCost: 2, parallelism: 1 } as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}
