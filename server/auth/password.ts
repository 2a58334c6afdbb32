import "server-only";
import { hash, verify } from "@node-rs/argon2";

// argon2id at the OWASP minimum or above: 19 MiB of memory, 2 iterations, 1 lane.
// (@node-rs/argon2 defaults to argon2id; the numbers are pinned here so a library change cannot lower them.)
export const PASSWORD_HASH_OPTIONS = {
  memoryCost: 19456,
  timeCost: 2,
  parallelism: 1,
  outputLen: 32,
} as const;

export function hashPassword(password: string): Promise<string> {
  return hash(password, PASSWORD_HASH_OPTIONS);
}

export async function verifyPassword(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}
