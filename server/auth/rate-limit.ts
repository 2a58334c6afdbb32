import "server-only";
import { sql, type Kysely } from "kysely";
import type { Database } from "@/db/types";

// Attempt counting in PostgreSQL (table auth_attempts), so every app instance sees the same
// counts. A limit is "at most `max` attempts of this kind for this key in the last `windowMinutes`".
export interface RateLimit {
  kind: string;
  max: number;
  windowMinutes: number;
}

// Per address limits are looser than per account ones: without a proxy in front, every client
// shares one address key (see clientAddressKey) and must not lock each other out quickly.
export const RATE_LIMITS = {
  signInAccount: { kind: "sign-in:account", max: 5, windowMinutes: 15 },
  signInAddress: { kind: "sign-in:address", max: 30, windowMinutes: 15 },
  resetAccount: { kind: "reset:account", max: 3, windowMinutes: 15 },
  resetAddress: { kind: "reset:address", max: 20, windowMinutes: 15 },
} as const satisfies Record<string, RateLimit>;

/** Minutes until the key may try again (0 when it may try now). */
export async function minutesUntilAllowed(
  db: Kysely<Database>,
  limit: RateLimit,
  key: string,
  now = new Date(),
): Promise<number> {
  const since = new Date(now.getTime() - limit.windowMinutes * 60_000);
  const row = await db
    .selectFrom("auth_attempts")
    .select([sql<number>`count(*)::int`.as("count"), sql<Date | null>`min(created_at)`.as("oldest")])
    .where("kind", "=", limit.kind)
    .where("key", "=", key)
    .where("created_at", ">", since)
    .executeTakeFirstOrThrow();
  if (row.count < limit.max || !row.oldest) return 0;
  // The window frees up when the oldest counted attempt leaves it.
  const freeAt = new Date(row.oldest).getTime() + limit.windowMinutes * 60_000;
  return Math.max(1, Math.ceil((freeAt - now.getTime()) / 60_000));
}

/** The longest wait over several limits (0 when all allow). */
export async function minutesUntilAllowedAll(
  db: Kysely<Database>,
  checks: [RateLimit, string][],
  now = new Date(),
): Promise<number> {
  const waits = await Promise.all(checks.map(([limit, key]) => minutesUntilAllowed(db, limit, key, now)));
  return Math.max(0, ...waits);
}

export async function recordAttempts(db: Kysely<Database>, checks: [RateLimit, string][]): Promise<void> {
  await db
    .insertInto("auth_attempts")
    .values(checks.map(([limit, key]) => ({ kind: limit.kind, key })))
    .execute();
}

export async function clearAttempts(db: Kysely<Database>, limit: RateLimit, key: string): Promise<void> {
  await db.deleteFrom("auth_attempts").where("kind", "=", limit.kind).where("key", "=", key).execute();
}

/** Drops rows older than every window (called opportunistically; no job needed). */
export async function pruneAttempts(db: Kysely<Database>, now = new Date()): Promise<void> {
  const oldest = Math.max(...Object.values(RATE_LIMITS).map((l) => l.windowMinutes));
  await db
    .deleteFrom("auth_attempts")
    .where("created_at", "<", new Date(now.getTime() - oldest * 60_000))
    .execute();
}

export function tooManyAttemptsMessage(minutes: number): string {
  return `Too many attempts. Try again in ${minutes} ${minutes === 1 ? "minute" : "minutes"}.`;
}

/**
 * The client address key: the first hop of X-Forwarded-For, else one fixed key. Trusting the
 * header is right only behind a proxy that sets it (a known limit, see DEVELOPERS.md); the
 * per-account limit holds regardless.
 */
export function clientAddressKey(headers: Headers): string {
  const first = headers.get("x-forwarded-for")?.split(",")[0]?.trim();
  return first ? first.slice(0, 64).toLowerCase() : "direct";
}
