import { randomUUID } from "node:crypto";
import { afterAll, beforeAll } from "vitest";
import type { Role } from "@/db/tables/core";
import { deleteWithFrozenGuardOff, getTestDb } from "./test-db";

// A test file's own organisation and people (unique slug and e-mails), so it never collides with
// the e2e seed or with other suites sharing the database.

/** A new organisation `Org <label>-<8 hex>`, and `person` to add a member with the given roles. */
export async function createTaggedOrg(label: string) {
  const db = getTestDb();
  const tag = `${label}-${randomUUID().slice(0, 8)}`;
  const org = await db
    .insertInto("organizations")
    .values({ name: `Org ${tag}`, slug: tag })
    .returning("id")
    .executeTakeFirstOrThrow();
  const person = async (who: string, roles: Role[]) => {
    const email = `${who}.${tag}@test.example`;
    const u = await db
      .insertInto("users")
      .values({ email, display_name: `${who} ${tag}`, password_hash: null })
      .returning("id")
      .executeTakeFirstOrThrow();
    await db.insertInto("memberships").values({ organization_id: org.id, user_id: u.id, roles }).execute();
    return { userId: u.id, email };
  };
  return { organizationId: org.id, tag, person };
}

/**
 * Removes an organisation made by a suite, with its members. An approved revision refuses DELETE
 * (by design); the suite's own data is removed with that trigger off inside one transaction, so
 * nobody else ever sees it disabled.
 */
export async function dropTaggedOrg(organizationId: string) {
  const db = getTestDb();
  const members = await db
    .selectFrom("memberships")
    .select("user_id")
    .where("organization_id", "=", organizationId)
    .execute();
  await deleteWithFrozenGuardOff(async (trx) => {
    await trx.deleteFrom("design_attachments").where("organization_id", "=", organizationId).execute();
    await trx.deleteFrom("design_revisions").where("organization_id", "=", organizationId).execute();
    await trx.deleteFrom("organizations").where("id", "=", organizationId).execute();
  });
  if (members.length)
    await db
      .deleteFrom("users")
      .where(
        "id",
        "in",
        members.map((m) => m.user_id),
      )
      .execute();
}

/**
 * The file's organisation for all its tests: made by `create` before them (the returned object is
 * filled in then) and dropped after them.
 */
export function orgForSuite<T extends { organizationId: string }>(create: () => Promise<T>): T {
  const org = {} as T;
  beforeAll(async () => {
    Object.assign(org, await create());
  });
  afterAll(async () => {
    if (org.organizationId) await dropTaggedOrg(org.organizationId);
  });
  return org;
}

/** How many rows of `table` the organisation has (to show that a refused request stored nothing). */
export async function countOrgRows(
  table: "designs" | "design_revisions" | "design_attachments",
  organizationId: string,
): Promise<number> {
  const row = await getTestDb()
    .selectFrom(table)
    .select((eb) => eb.fn.countAll().as("n"))
    .where("organization_id", "=", organizationId)
    .executeTakeFirstOrThrow();
  return Number(row.n);
}
