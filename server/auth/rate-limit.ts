import "server-only";
import { sql, type Kysely } from "kysely";
import type { Database } from "@/db/types";
import { getEnv } from "@/server/env";

// Attempt counting in PostgreSQL (table auth_attempts), so every app instance sees the same
// counts. A limit is "at most `max` attempts of this kind for this key in the last `windowMinutes`".
export interface RateLimit {
  kind: string;
  max: number;
  windowMinutes: number;
}

// Per address limits are looser than per account ones: many people may share one address (an
// office behind one NAT, see clientAddressKey) and must not lock each other out quickly.
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

export type Reservation = { allowed: true; attemptIds: number[] } | { allowed: false; minutes: number };

/**
 * Counts an attempt BEFORE the work it limits (a password check, a reset mail), atomically: one
 * transaction takes a per-key advisory lock for each limit (in a fixed order, so two requests never
 * deadlock), counts, and records the attempt only when every limit allows it. Parallel requests for
 * one key therefore queue on the lock, and at most `max` of them get through per window, however
 * many arrive at once. The caller may release the recorded rows afterwards (a successful sign-in
 * does not count as a failure).
 */
export async function reserveAttempt(
  db: Kysely<Database>,
  checks: [RateLimit, string][],
  now = new Date(),
): Promise<Reservation> {
  const ordered = [...checks].sort(([a, ka], [b, kb]) => (`${a.kind}|${ka}` < `${b.kind}|${kb}` ? -1 : 1));
  return db.transaction().execute(async (trx) => {
    for (const [limit, key] of ordered) {
      await sql`select pg_advisory_xact_lock(hashtextextended(${`${limit.kind}|${key}`}, 0))`.execute(trx);
    }
    const waits = [];
    for (const [limit, key] of ordered) waits.push(await minutesUntilAllowed(trx, limit, key, now));
    const minutes = Math.max(0, ...waits);
    if (minutes > 0) return { allowed: false, minutes };
    const rows = await trx
      .insertInto("auth_attempts")
      .values(ordered.map(([limit, key]) => ({ kind: limit.kind, key, created_at: now })))
      .returning("id")
      .execute();
    return { allowed: true, attemptIds: rows.map((r) => Number(r.id)) };
  });
}

/** Takes back attempts recorded by reserveAttempt (e.g. the sign-in succeeded). */
export async function releaseAttempts(db: Kysely<Database>, attemptIds: number[]): Promise<void> {
  if (attemptIds.length === 0) return;
  await db.deleteFrom("auth_attempts").where("id", "in", attemptIds).execute();
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
 * The client address key for the per-address limits. `next start` gives route handlers and server
 * actions no socket address; its server writes the TCP peer's address into X-Forwarded-For, but only
 * when the request carries no such header (it never appends). So:
 * - trustedHops = 0 (TRUST_PROXY_HOPS unset, no proxy): the header's last entry, which is the peer's
 *   address when the client sent none. A client that sends its own header picks its own key and so
 *   escapes the per-address limit; the per-account limit still holds, atomically.
 * - trustedHops = n: the n-th entry from the right, i.e. the address the outermost of n proxies
 *   (each appending, like nginx's $proxy_add_x_forwarded_for) received the request from. Entries a
 *   client forged sit to the left of it and are never read.
 */
export function clientAddressKey(headers: Headers, trustedHops: number = getEnv().TRUST_PROXY_HOPS): string {
  const hops = (headers.get("x-forwarded-for") ?? "")
    .split(",")
    .map((hop) => hop.trim())
    .filter(Boolean);
  const chosen = hops[Math.max(0, hops.length - Math.max(1, trustedHops))];
  return chosen ? chosen.slice(0, 64).toLowerCase() : "unknown";
}
