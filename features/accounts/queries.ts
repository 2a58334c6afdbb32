import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { Role } from "@/db/tables/core";
import { sortRoles } from "@/server/auth/viewer";

// Reads for the account screens; DTOs only (never a users row: it holds the password hash).
export interface OrganizationChoice {
  id: string;
  name: string;
  slug: string;
  roles: Role[];
}

/** Every organisation the user belongs to, for the switcher. */
export async function listUserOrganizations(
  db: Kysely<Database>,
  userId: string,
): Promise<OrganizationChoice[]> {
  const rows = await db
    .selectFrom("memberships")
    .innerJoin("organizations", "organizations.id", "memberships.organization_id")
    .select(["organizations.id", "organizations.name", "organizations.slug", "memberships.roles"])
    .where("memberships.user_id", "=", userId)
    .orderBy("organizations.name")
    .execute();
  return rows.map((r) => ({ id: r.id, name: r.name, slug: r.slug, roles: sortRoles(r.roles) }));
}

/** The user's oldest membership: where a fresh session starts. */
export async function findDefaultOrganizationId(
  db: Kysely<Database>,
  userId: string,
): Promise<string | null> {
  const row = await db
    .selectFrom("memberships")
    .select("organization_id")
    .where("user_id", "=", userId)
    .orderBy("created_at")
    .limit(1)
    .executeTakeFirst();
  return row?.organization_id ?? null;
}
