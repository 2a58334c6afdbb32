import { randomUUID } from "node:crypto";
import { getTestDb, deleteWithFrozenGuardOff } from "../../setup/test-db";

// Each test file makes its own organisation and people (unique slugs and e-mails), so it never
// collides with the e2e seed or with other suites sharing the database.
export async function createOrgWithUsers(label: string) {
  const db = getTestDb();
  const tag = `${label}-${randomUUID().slice(0, 8)}`;
  const org = await db
    .insertInto("organizations")
    .values({ name: `Org ${tag}`, slug: tag })
    .returning("id")
    .executeTakeFirstOrThrow();
  const mk = async (who: string, roles: ("designer" | "approver" | "admin")[]) => {
    const u = await db
      .insertInto("users")
      .values({ email: `${who}.${tag}@test.example`, display_name: `${who} ${tag}`, password_hash: null })
      .returning("id")
      .executeTakeFirstOrThrow();
    await db.insertInto("memberships").values({ organization_id: org.id, user_id: u.id, roles }).execute();
    return u.id;
  };
  return {
    organizationId: org.id,
    slug: tag,
    adminId: await mk("admin", ["admin", "designer"]),
    designerId: await mk("designer", ["designer"]),
  };
}

export async function dropOrg(organizationId: string) {
  const db = getTestDb();
  const members = await db
    .selectFrom("memberships")
    .select("user_id")
    .where("organization_id", "=", organizationId)
    .execute();
  // An approved revision refuses DELETE (by design); the test's own data is removed with that
  // trigger off inside one transaction, so nobody else ever sees it disabled.
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
