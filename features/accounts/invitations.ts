import "server-only";
import { sql, type Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { Role } from "@/db/tables/core";
import { hashPassword, verifyPassword } from "@/server/auth/password";
import { createToken, hashToken } from "@/server/auth/tokens";
import { sortRoles } from "@/server/auth/viewer";

// Invitations by e-mail. Every query is scoped by organisation id (a foreign id is "not found").
export const INVITATION_VALID_DAYS = 7;

export interface IssuedInvitation {
  invitationId: string;
  email: string;
  roles: Role[];
  token: string;
  expiresAt: Date;
}

export type InviteOutcome =
  { ok: true; invitation: IssuedInvitation } | { ok: false; field?: "email"; message: string };

function expiry(now: Date): Date {
  return new Date(now.getTime() + INVITATION_VALID_DAYS * 86_400_000);
}

/** Creates an invitation, or renews the open one for the same address (new link, new roles). */
export async function createInvitation(
  db: Kysely<Database>,
  input: { organizationId: string; invitedBy: string; email: string; roles: Role[] },
  now = new Date(),
): Promise<InviteOutcome> {
  const member = await db
    .selectFrom("memberships")
    .innerJoin("users", "users.id", "memberships.user_id")
    .select("users.id")
    .where("memberships.organization_id", "=", input.organizationId)
    .where("users.email", "=", input.email)
    .executeTakeFirst();
  if (member) return { ok: false, field: "email", message: "This person is already a member." };
  const { token, tokenHash } = createToken();
  const roles = sortRoles(input.roles);
  const expiresAt = expiry(now);
  const row = await db
    .insertInto("invitations")
    .values({
      organization_id: input.organizationId,
      email: input.email,
      roles,
      token_hash: tokenHash,
      invited_by: input.invitedBy,
      expires_at: expiresAt,
    })
    .onConflict((oc) =>
      oc
        .columns(["organization_id", "email"])
        .where("accepted_at", "is", null)
        .where("revoked_at", "is", null)
        .doUpdateSet({ roles, token_hash: tokenHash, invited_by: input.invitedBy, expires_at: expiresAt }),
    )
    .returning("id")
    .executeTakeFirstOrThrow();
  return { ok: true, invitation: { invitationId: row.id, email: input.email, roles, token, expiresAt } };
}

/** A new link for an open invitation (the old link stops working); null when not found here. */
export async function renewInvitation(
  db: Kysely<Database>,
  organizationId: string,
  invitationId: string,
  now = new Date(),
): Promise<IssuedInvitation | null> {
  const { token, tokenHash } = createToken();
  const expiresAt = expiry(now);
  const row = await db
    .updateTable("invitations")
    .set({ token_hash: tokenHash, expires_at: expiresAt })
    .where("id", "=", invitationId)
    .where("organization_id", "=", organizationId)
    .where("accepted_at", "is", null)
    .where("revoked_at", "is", null)
    .returning(["id", "email", "roles"])
    .executeTakeFirst();
  return row
    ? { invitationId: row.id, email: row.email, roles: sortRoles(row.roles), token, expiresAt }
    : null;
}

export async function revokeInvitation(
  db: Kysely<Database>,
  organizationId: string,
  invitationId: string,
  now = new Date(),
): Promise<boolean> {
  const result = await db
    .updateTable("invitations")
    .set({ revoked_at: now })
    .where("id", "=", invitationId)
    .where("organization_id", "=", organizationId)
    .where("accepted_at", "is", null)
    .where("revoked_at", "is", null)
    .executeTakeFirst();
  return Number(result.numUpdatedRows) === 1;
}

export type InvitationView =
  | { state: "open"; email: string; organizationName: string; roles: Role[]; hasAccount: boolean }
  | { state: "expired" | "used" | "unknown" };

export const INVITATION_MESSAGES = {
  expired: "This invitation has expired. Ask your administrator to send a new one.",
  used: "This invitation has already been used or withdrawn. Sign in, or ask your administrator for a new one.",
  unknown: "This invitation link is not valid. Ask your administrator for a new one.",
};

export async function viewInvitation(
  db: Kysely<Database>,
  token: string,
  now = new Date(),
): Promise<InvitationView> {
  const row = await db
    .selectFrom("invitations")
    .innerJoin("organizations", "organizations.id", "invitations.organization_id")
    .select([
      "invitations.email",
      "invitations.roles",
      "invitations.expires_at",
      "invitations.accepted_at",
      "invitations.revoked_at",
      "organizations.name",
    ])
    .select((eb) =>
      eb
        .exists(eb.selectFrom("users").select("users.id").whereRef("users.email", "=", "invitations.email"))
        .as("has_account"),
    )
    .where("invitations.token_hash", "=", hashToken(token))
    .executeTakeFirst();
  if (!row) return { state: "unknown" };
  if (row.accepted_at || row.revoked_at) return { state: "used" };
  if (new Date(row.expires_at) <= now) return { state: "expired" };
  return {
    state: "open",
    email: row.email,
    organizationName: row.name,
    roles: sortRoles(row.roles),
    hasAccount: Boolean(row.has_account),
  };
}

export type AcceptOutcome =
  | { ok: true; userId: string; organizationId: string }
  | { ok: false; message: string; fieldErrors?: Record<string, string[]> };

/**
 * New invitees give a name and a password (>= 10 characters); an existing account confirms its
 * current password. Spends the invitation in the same transaction that adds the membership.
 */
export async function acceptInvitation(
  db: Kysely<Database>,
  input: { token: string; displayName?: string; password: string },
  now = new Date(),
): Promise<AcceptOutcome> {
  return db.transaction().execute(async (trx): Promise<AcceptOutcome> => {
    const invitation = await trx
      .selectFrom("invitations")
      .select(["id", "organization_id", "email", "roles", "expires_at", "accepted_at", "revoked_at"])
      .where("token_hash", "=", hashToken(input.token))
      .forUpdate()
      .executeTakeFirst();
    if (!invitation) return { ok: false, message: INVITATION_MESSAGES.unknown };
    if (invitation.accepted_at || invitation.revoked_at)
      return { ok: false, message: INVITATION_MESSAGES.used };
    if (new Date(invitation.expires_at) <= now) return { ok: false, message: INVITATION_MESSAGES.expired };

    const existing = await trx
      .selectFrom("users")
      .select(["id", "password_hash"])
      .where("email", "=", invitation.email)
      .executeTakeFirst();
    let userId: string;
    if (existing) {
      if (!existing.password_hash || !(await verifyPassword(existing.password_hash, input.password))) {
        return {
          ok: false,
          message: "That is not the password of this account.",
          fieldErrors: { password: ["That is not the password of this account."] },
        };
      }
      userId = existing.id;
    } else {
      const name = input.displayName?.trim();
      if (!name)
        return { ok: false, message: "Enter your name.", fieldErrors: { displayName: ["Enter your name."] } };
      if (input.password.length < 10)
        return {
          ok: false,
          message: "Use at least 10 characters.",
          fieldErrors: { password: ["Use at least 10 characters."] },
        };
      const created = await trx
        .insertInto("users")
        .values({
          email: invitation.email,
          display_name: name,
          password_hash: await hashPassword(input.password),
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      userId = created.id;
    }
    await trx
      .insertInto("memberships")
      .values({ organization_id: invitation.organization_id, user_id: userId, roles: invitation.roles })
      .onConflict((oc) =>
        oc.columns(["organization_id", "user_id"]).doUpdateSet({
          roles: sql`(select array_agg(distinct r) from unnest(memberships.roles || excluded.roles) r)`,
        }),
      )
      .execute();
    await trx.updateTable("invitations").set({ accepted_at: now }).where("id", "=", invitation.id).execute();
    return { ok: true, userId, organizationId: invitation.organization_id };
  });
}
