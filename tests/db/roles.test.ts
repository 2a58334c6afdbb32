import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { RUNTIME_GROUP, runtimeTableAccess } from "@/db/runtime-grants";
import { getOwnerTestDb, getTestDb } from "../setup/test-db";
import { createReviewOrg, createSampleDesign, dropReviewOrg } from "../features/reviews/helpers";

// The app's database role (DATABASE_URL) against the real PostgreSQL: it owns nothing and cannot
// change the schema, switch a guard off, empty a table or rewrite history; the owner role
// (MIGRATION_DATABASE_URL) runs the migrations. Every other suite connects as the runtime role too,
// so the app's normal work is proven to need no more than these grants.
const db = getTestDb();
const owner = getOwnerTestDb();
let org: Awaited<ReturnType<typeof createReviewOrg>>;
let designId: string;
const history = [
  "design_activity",
  "revision_comments",
  "revision_decisions",
  "revision_justifications",
  "revision_editors",
];

beforeAll(async () => {
  org = await createReviewOrg("roles");
  ({ designId } = await createSampleDesign(org.organizationId, org.designer.userId, "Roles"));
});
afterAll(async () => {
  await dropReviewOrg(org.organizationId);
});

const permissionDenied = /permission denied|must be owner/;

describe("database roles (real PostgreSQL)", () => {
  it("connects the app as a role that is neither owner nor superuser, and the migrations as the owner", async () => {
    const me = await sql<{ name: string; superuser: boolean; createrole: boolean; createdb: boolean }>`
      select current_user as name, rolsuper as superuser, rolcreaterole as createrole, rolcreatedb as createdb
      from pg_roles where rolname = current_user`.execute(db);
    expect(me.rows[0]).toMatchObject({ superuser: false, createrole: false, createdb: false });
    const owns = await sql<{ n: number }>`
      select count(*)::int as n from pg_class c join pg_namespace n on n.oid = c.relnamespace
      where c.relowner = (select oid from pg_roles where rolname = current_user)`.execute(db);
    expect(owns.rows[0]!.n).toBe(0);
    const tables = await sql<{ owner: string }>`
      select distinct tableowner as owner from pg_tables where schemaname in ('public', 'pgboss')`.execute(
      db,
    );
    const ownerName = await sql<{ name: string }>`select current_user as name`.execute(owner);
    expect(tables.rows.map((r) => r.owner)).toEqual([ownerName.rows[0]!.name]);
    expect(ownerName.rows[0]!.name).not.toBe(me.rows[0]!.name);
    const member = await sql<{
      ok: boolean;
    }>`select pg_has_role(current_user, ${ownerName.rows[0]!.name}, 'member') as ok`.execute(db);
    expect(member.rows[0]!.ok).toBe(false);
  });

  it("refuses DDL, TRUNCATE, switching triggers off and temporary tables", async () => {
    await expect(
      sql`alter table design_revisions disable trigger design_revisions_frozen_when_approved`.execute(db),
    ).rejects.toThrow(permissionDenied);
    await expect(sql`alter table design_activity disable trigger all`.execute(db)).rejects.toThrow(
      permissionDenied,
    );
    await expect(sql`truncate design_activity`.execute(db)).rejects.toThrow(permissionDenied);
    await expect(sql`truncate design_revisions cascade`.execute(db)).rejects.toThrow(permissionDenied);
    await expect(sql`drop table design_activity`.execute(db)).rejects.toThrow(permissionDenied);
    await expect(sql`drop table pgboss.job`.execute(db)).rejects.toThrow(permissionDenied);
    await expect(sql`drop function refuse_decision_by_editor() cascade`.execute(db)).rejects.toThrow(
      permissionDenied,
    );
    await expect(
      sql`alter table design_revisions drop constraint design_revisions_four_eyes`.execute(db),
    ).rejects.toThrow(permissionDenied);
    await expect(sql`create table public.sneaky (id int)`.execute(db)).rejects.toThrow(permissionDenied);
    await expect(sql`create table pgboss.sneaky (id int)`.execute(db)).rejects.toThrow(permissionDenied);
    await expect(sql`create schema sneaky`.execute(db)).rejects.toThrow(permissionDenied);
    await expect(sql`create temporary table sneaky (id int)`.execute(db)).rejects.toThrow(permissionDenied);
    await expect(
      sql`create or replace function refuse_change_to_history_row() returns trigger language plpgsql as $$ begin return new; end $$`.execute(
        db,
      ),
    ).rejects.toThrow(permissionDenied);
  });

  it("refuses UPDATE and DELETE of history rows by privilege, not only by trigger", async () => {
    const entry = await db
      .selectFrom("design_activity")
      .select("id")
      .where("design_id", "=", designId)
      .executeTakeFirstOrThrow();
    await expect(
      sql`update design_activity set detail = 'rewritten' where id = ${entry.id}`.execute(db),
    ).rejects.toThrow(permissionDenied);
    await expect(sql`delete from design_activity where id = ${entry.id}`.execute(db)).rejects.toThrow(
      permissionDenied,
    );
    for (const table of history) {
      await expect(sql`delete from ${sql.table(table)}`.execute(db)).rejects.toThrow(permissionDenied);
      await expect(sql`update ${sql.table(table)} set revision_id = revision_id`.execute(db)).rejects.toThrow(
        permissionDenied,
      );
    }
    expect(
      (
        await db
          .selectFrom("design_activity")
          .select("detail")
          .where("id", "=", entry.id)
          .executeTakeFirstOrThrow()
      ).detail,
    ).not.toBe("rewritten");
  });

  it("grants each table what the rules say: history append-only, bookkeeping read-only, no TRUNCATE anywhere", async () => {
    const access = await runtimeTableAccess(owner);
    for (const table of history) expect(access.get(table)).toBe("append");
    expect(access.get("kysely_migration")).toBe("read");
    expect(access.get("design_revisions")).toBe("read-write");
    const { rows } = await sql<{
      table: string;
      sel: boolean;
      ins: boolean;
      upd: boolean;
      del: boolean;
      trunc: boolean;
      refs: boolean;
      trig: boolean;
    }>`
      select c.relname as table,
        has_table_privilege(current_user, c.oid, 'select') as sel,
        has_table_privilege(current_user, c.oid, 'insert') as ins,
        has_table_privilege(current_user, c.oid, 'update') as upd,
        has_table_privilege(current_user, c.oid, 'delete') as del,
        has_table_privilege(current_user, c.oid, 'truncate') as trunc,
        has_table_privilege(current_user, c.oid, 'references') as refs,
        has_table_privilege(current_user, c.oid, 'trigger') as trig
      from pg_class c join pg_namespace n on n.oid = c.relnamespace
      where n.nspname = 'public' and c.relkind in ('r', 'p')`.execute(db);
    expect(rows.length).toBe(access.size);
    for (const row of rows) {
      const want = access.get(row.table);
      expect(row).toEqual({
        table: row.table,
        sel: true,
        ins: want !== "read",
        upd: want === "read-write",
        del: want === "read-write",
        trunc: false,
        refs: false,
        trig: false,
      });
    }
    const group = await sql<{
      ok: boolean;
    }>`select pg_has_role(current_user, ${RUNTIME_GROUP}, 'member') as ok`.execute(db);
    expect(group.rows[0]!.ok).toBe(true);
  });

  it("still cascades a deleted organisation into its history, as the owner of those tables", async () => {
    const temp = await createReviewOrg("roles-cascade");
    const created = await createSampleDesign(temp.organizationId, temp.designer.userId, "Cascade");
    await db.deleteFrom("designs").where("id", "=", created.designId).execute();
    const left = await db
      .selectFrom("design_activity")
      .select("id")
      .where("design_id", "=", created.designId)
      .execute();
    expect(left).toEqual([]);
    await dropReviewOrg(temp.organizationId);
  });
});
