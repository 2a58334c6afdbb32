import { sql } from "kysely";
import { afterAll, beforeEach, describe, expect, it } from "vitest";
import { listMigrationNames } from "@/db/migration-names";
import { migrateToLatest } from "@/db/migrate-to-latest";
import { getHealth } from "@/features/health/queries";
import { clearTables, getOwnerTestDb, getTestDb } from "../setup/test-db";

const db = getTestDb();
const owner = getOwnerTestDb();

describe("database foundation (real PostgreSQL)", () => {
  beforeEach(() => clearTables());
  afterAll(() => clearTables());

  it("is migrated to the newest migration file and records it in app_meta", async () => {
    const report = await migrateToLatest(owner);
    expect(report.applied).toEqual([]); // scripts/test.sh already migrated; a second run is a no-op
    const names = await listMigrationNames();
    const meta = await db.selectFrom("app_meta").select("schema_version").executeTakeFirstOrThrow();
    expect(meta.schema_version).toBe(names.at(-1));
  });

  it("writes an organisation, a user and a membership and reads them back", async () => {
    const org = await db
      .insertInto("organizations")
      .values({ name: "Test Works", slug: "test-works" })
      .returning("id")
      .executeTakeFirstOrThrow();
    const user = await db
      .insertInto("users")
      .values({ email: "tess@test-works.example", display_name: "Tess", password_hash: null })
      .returning("id")
      .executeTakeFirstOrThrow();
    await db
      .insertInto("memberships")
      .values({ organization_id: org.id, user_id: user.id, roles: ["designer", "approver"] })
      .execute();

    const row = await db
      .selectFrom("memberships")
      .innerJoin("users", "users.id", "memberships.user_id")
      .select(["users.email", "memberships.roles"])
      .where("memberships.organization_id", "=", org.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ email: "tess@test-works.example", roles: ["designer", "approver"] });
  });

  it("refuses an unknown role and an e-mail address that is not lower case", async () => {
    const org = await db
      .insertInto("organizations")
      .values({ name: "X", slug: "x" })
      .returning("id")
      .executeTakeFirstOrThrow();
    const user = await db
      .insertInto("users")
      .values({ email: "x@x.example", display_name: "X", password_hash: null })
      .returning("id")
      .executeTakeFirstOrThrow();
    await expect(
      db
        .insertInto("memberships")
        .values({ organization_id: org.id, user_id: user.id, roles: ["owner" as never] })
        .execute(),
    ).rejects.toThrow(/memberships_roles_known/);
    await expect(
      db
        .insertInto("users")
        .values({ email: "Mixed@X.example", display_name: "M", password_hash: null })
        .execute(),
    ).rejects.toThrow(/users_email_lower/);
  });

  it("reports health: green when current, a reason when a migration is missing", async () => {
    expect(await getHealth(db)).toMatchObject({ ok: true });
    const newest = (await listMigrationNames()).at(-1)!;
    await sql`delete from kysely_migration where name = ${newest}`.execute(owner);
    try {
      expect(await getHealth(db)).toEqual({ ok: false, reason: `migrations pending: ${newest}` });
    } finally {
      await sql`insert into kysely_migration (name, timestamp) values (${newest}, now()::text)`.execute(
        owner,
      );
    }
  });
});
