import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import { hashPassword, verifyPassword } from "@/server/auth/password";
import {
  minutesUntilAllowedAll,
  pruneAttempts,
  RATE_LIMITS,
  recordAttempts,
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
  const wait = await minutesUntilAllowedAll(db, checks, now);
  if (wait > 0) return { ok: false, message: tooManyAttemptsMessage(wait), limited: true };

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
    await recordAttempts(db, checks);
    return { ok: false, message: WRONG_CREDENTIALS, limited: false };
  }
  // A success does not wipe the account's failures: an attacker who also knows the password
  // gains nothing, and the window expires on its own. Old rows are pruned here.
  await pruneAttempts(db, now);
  return { ok: true, userId: user.id, organizationId };
}
