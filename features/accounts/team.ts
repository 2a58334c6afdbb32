import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { Role } from "@/db/tables/core";
import { sortRoles } from "@/server/auth/viewer";
import { isoString } from "@/db/dates";

// The Crew screen's data and its member changes. Every statement is scoped by the viewer's
// organisation: another organisation's member id simply is not found.
export interface TeamMemberDto {
  userId: string;
  displayName: string;
  email: string;
  roles: Role[];
  joinedAt: string;
}

export interface PendingInvitationDto {
  invitationId: string;
  email: string;
  roles: Role[];
  expiresAt: string;
  expired: boolean;
}

export interface TeamDto {
  members: TeamMemberDto[];
  invitations: PendingInvitationDto[];
}

export async function getTeam(
  db: Kysely<Database>,
  organizationId: string,
  now = new Date(),
): Promise<TeamDto> {
  const members = await db
    .selectFrom("memberships")
    .innerJoin("users", "users.id", "memberships.user_id")
    .select(["users.id", "users.display_name", "users.email", "memberships.roles", "memberships.created_at"])
    .where("memberships.organization_id", "=", organizationId)
    .orderBy("users.display_name")
    .execute();
  const invitations = await db
    .selectFrom("invitations")
    .select(["id", "email", "roles", "expires_at"])
    .where("organization_id", "=", organizationId)
    .where("accepted_at", "is", null)
    .where("revoked_at", "is", null)
    .orderBy("created_at", "desc")
    .execute();
  return {
    members: members.map((m) => ({
      userId: m.id,
      displayName: m.display_name,
      email: m.email,
      roles: sortRoles(m.roles),
      joinedAt: isoString(m.created_at),
    })),
    invitations: invitations.map((i) => ({
      invitationId: i.id,
      email: i.email,
      roles: sortRoles(i.roles),
      expiresAt: isoString(i.expires_at),
      expired: new Date(i.expires_at) <= now,
    })),
  };
}

export type MemberChange = "ok" | "not-found" | "last-admin";
export const LAST_ADMIN_MESSAGE =
  "An organisation keeps at least one administrator. Make someone else an administrator first.";

/** Locks the organisation's memberships so two admins demoting each other cannot both succeed. */
async function lockMembers(trx: Kysely<Database>, organizationId: string) {
  return trx
    .selectFrom("memberships")
    .select(["user_id", "roles"])
    .where("organization_id", "=", organizationId)
    .forUpdate()
    .execute();
}

/**
 * One change to a membership, under the lock: "not-found" when the user is no member, "last-admin"
 * when the change would leave the organisation without an administrator (`staysAdmin`: the member
 * still is one afterwards), else `write` runs in the same transaction.
 */
async function changeMember(
  db: Kysely<Database>,
  organizationId: string,
  userId: string,
  staysAdmin: boolean,
  write: (trx: Kysely<Database>) => Promise<void>,
): Promise<MemberChange> {
  return db.transaction().execute(async (trx): Promise<MemberChange> => {
    const members = await lockMembers(trx, organizationId);
    const target = members.find((m) => m.user_id === userId);
    if (!target) return "not-found";
    const otherAdmins = members.filter((m) => m.user_id !== userId && m.roles.includes("admin")).length;
    if (!staysAdmin && target.roles.includes("admin") && otherAdmins === 0) return "last-admin";
    await write(trx);
    return "ok";
  });
}

export async function changeMemberRoles(
  db: Kysely<Database>,
  organizationId: string,
  userId: string,
  roles: Role[],
): Promise<MemberChange> {
  return changeMember(db, organizationId, userId, roles.includes("admin"), async (trx) => {
    await trx
      .updateTable("memberships")
      .set({ roles: sortRoles(roles) })
      .where("organization_id", "=", organizationId)
      .where("user_id", "=", userId)
      .execute();
  });
}

export async function removeMember(
  db: Kysely<Database>,
  organizationId: string,
  userId: string,
): Promise<MemberChange> {
  return changeMember(db, organizationId, userId, false, async (trx) => {
    await trx
      .deleteFrom("memberships")
      .where("organization_id", "=", organizationId)
      .where("user_id", "=", userId)
      .execute();
    // Their sessions pointing at this organisation fall back to another membership (or none).
    await trx
      .updateTable("sessions")
      .set({ active_organization_id: null })
      .where("user_id", "=", userId)
      .where("active_organization_id", "=", organizationId)
      .execute();
  });
}
