import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import { hashPassword } from "@/server/auth/password";
import {
  RATE_LIMITS,
  reserveAttempt,
  tooManyAttemptsMessage,
  type RateLimit,
} from "@/server/auth/rate-limit";
import { createToken, hashToken } from "@/server/auth/tokens";
import { sendPasswordResetEmail } from "@/server/mail/messages";

// Password reset by e-mailed single-use link. The request answers the same sentence whether or
// not the address has an account; only the database row and the e-mail differ.
export const RESET_REQUESTED = "If an account exists for that address, we have sent a link.";
export const RESET_VALID_MINUTES = 60;

export async function requestPasswordReset(
  db: Kysely<Database>,
  input: { email: string; addressKey: string },
  now = new Date(),
): Promise<{ ok: true; message: string } | { ok: false; message: string }> {
  const checks: [RateLimit, string][] = [
    [RATE_LIMITS.resetAccount, input.email],
    [RATE_LIMITS.resetAddress, input.addressKey],
  ];
  const reservation = await reserveAttempt(db, checks, now);
  if (!reservation.allowed) return { ok: false, message: tooManyAttemptsMessage(reservation.minutes) };

  const user = await db
    .selectFrom("users")
    .select(["id", "email"])
    .where("email", "=", input.email)
    .where("disabled_at", "is", null)
    .executeTakeFirst();
  if (user) {
    const { token, tokenHash } = createToken();
    const expiresAt = new Date(now.getTime() + RESET_VALID_MINUTES * 60_000);
    await db
      .insertInto("password_reset_tokens")
      .values({ user_id: user.id, token_hash: tokenHash, expires_at: expiresAt })
      .execute();
    await sendPasswordResetEmail({ to: user.email, token, validMinutes: RESET_VALID_MINUTES });
  }
  return { ok: true, message: RESET_REQUESTED };
}

export type ResetTokenState = "valid" | "expired" | "used" | "unknown";

export async function getResetTokenState(
  db: Kysely<Database>,
  token: string,
  now = new Date(),
): Promise<ResetTokenState> {
  const row = await db
    .selectFrom("password_reset_tokens")
    .select(["expires_at", "used_at"])
    .where("token_hash", "=", hashToken(token))
    .executeTakeFirst();
  if (!row) return "unknown";
  if (row.used_at) return "used";
  return new Date(row.expires_at) <= now ? "expired" : "valid";
}

export const RESET_TOKEN_MESSAGES: Record<Exclude<ResetTokenState, "valid">, string> = {
  expired: "This reset link has expired. Ask for a new one.",
  used: "This reset link has already been used. Ask for a new one if you need to.",
  unknown: "This reset link is not valid. Ask for a new one.",
};

/** Sets the new password, spends every open link of the user and ends all their sessions. */
export async function resetPassword(
  db: Kysely<Database>,
  input: { token: string; password: string },
  now = new Date(),
): Promise<{ ok: true; userId: string } | { ok: false; message: string }> {
  const passwordHash = await hashPassword(input.password);
  return db
    .transaction()
    .execute(async (trx): Promise<{ ok: true; userId: string } | { ok: false; message: string }> => {
      const row = await trx
        .selectFrom("password_reset_tokens")
        .select(["id", "user_id", "expires_at", "used_at"])
        .where("token_hash", "=", hashToken(input.token))
        .forUpdate()
        .executeTakeFirst();
      if (!row) return { ok: false, message: RESET_TOKEN_MESSAGES.unknown };
      if (row.used_at) return { ok: false, message: RESET_TOKEN_MESSAGES.used };
      if (new Date(row.expires_at) <= now) return { ok: false, message: RESET_TOKEN_MESSAGES.expired };
      await trx
        .updateTable("users")
        .set({ password_hash: passwordHash })
        .where("id", "=", row.user_id)
        .execute();
      await trx
        .updateTable("password_reset_tokens")
        .set({ used_at: now })
        .where("user_id", "=", row.user_id)
        .where("used_at", "is", null)
        .execute();
      await trx.deleteFrom("sessions").where("user_id", "=", row.user_id).execute();
      return { ok: true, userId: row.user_id };
    });
}
