import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import { hashPassword, verifyPassword } from "@/server/auth/password";
import {
  pruneAttempts,
  RATE_LIMITS,
  releaseAttempts,
  reserveAttempt,
  tooManyAttemptsMessage,
  type RateLimit,
} from "@/server/auth/rate-limit";
import { findDefaultOrganizationId } from "./queries";

// Checking an e-mail and password. The failure message is the same whether the address is
// unknown, the password wrong or the account disabled, and an unknown address still costs one
// argon2 verification, so neither the text nor the timing tells which.
export const WRONG_CREDENTIALS = "E-mail or password is wrong.";

let dummyHash: Promise<string> | undefined;

export type SignInOutcome =
  { ok: true; userId: string; organizationId: string } | { ok: false; message: string; limited: boolean };

export async function authenticate(
  db: Kysely<Database>,
  input: { email: string; password: string; addressKey: string },
  now = new Date(),
): Promise<SignInOutcome> {
  const checks: [RateLimit, string][] = [
    [RATE_LIMITS.signInAccount, input.email],
    [RATE_LIMITS.signInAddress, input.addressKey],
  ];
  // The attempt is counted before the password is checked (atomically, per key), so parallel
  // guesses cannot all slip in before the first failure is written.
  const reservation = await reserveAttempt(db, checks, now);
  if (!reservation.allowed)
    return { ok: false, message: tooManyAttemptsMessage(reservation.minutes), limited: true };

  const user = await db
    .selectFrom("users")
    .select(["id", "password_hash", "disabled_at"])
    .where("email", "=", input.email)
    .executeTakeFirst();
  dummyHash ??= hashPassword("sealpitch-timing-equaliser");
  const passwordOk = await verifyPassword(user?.password_hash ?? (await dummyHash), input.password);
  const organizationId =
    user && passwordOk && !user.disabled_at ? await findDefaultOrganizationId(db, user.id) : null;

  if (!user || !passwordOk || user.disabled_at || !organizationId) {
    return { ok: false, message: WRONG_CREDENTIALS, limited: false };
  }
  // A success takes back only its own attempt; it does not wipe the account's failures (an
  // attacker who also knows the password gains nothing, and the window expires on its own).
  // Old rows are pruned here.
  await releaseAttempts(db, reservation.attemptIds);
  await pruneAttempts(db, now);
  return { ok: true, userId: user.id, organizationId };
}
