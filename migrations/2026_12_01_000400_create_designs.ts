import { type Kysely, sql } from "kysely";

// Flange designs and their numbered revisions. The working revision is edited in place (every
// save bumps `version`, which callers compare to refuse stale saves); submitting freezes a
// snapshot (document, result, core version, content hash). An approved revision never changes:
// the trigger below refuses updates to it, whatever the application does.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("designs")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("organization_id", "uuid", (col) =>
      col.notNull().references("organizations.id").onDelete("cascade"),
    )
    .addColumn("name", "text", (col) => col.notNull())
    .addColumn("equipment_tag", "text", (col) => col.notNull().defaultTo(""))
    .addColumn("outline_kind", "text", (col) => col.notNull())
    .addColumn("owner_id", "uuid", (col) => col.notNull().references("users.id"))
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addColumn("updated_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addColumn("archived_at", "timestamptz")
    .execute();
  await db.schema
    .createIndex("designs_org_updated_idx")
    .on("designs")
    .columns(["organization_id", "updated_at"])
    .execute();

  await db.schema
    .createTable("design_revisions")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("design_id", "uuid", (col) => col.notNull().references("designs.id").onDelete("cascade"))
    .addColumn("organization_id", "uuid", (col) =>
      col.notNull().references("organizations.id").onDelete("cascade"),
    )
    .addColumn("number", "integer", (col) => col.notNull())
    .addColumn("status", "text", (col) => col.notNull().defaultTo("draft"))
    .addColumn("document", "jsonb", (col) => col.notNull())
    .addColumn("result", "jsonb")
    .addColumn("core_version", "text")
    .addColumn("content_hash", "text")
    .addColumn("version", "integer", (col) => col.notNull().defaultTo(1))
    .addColumn("created_by", "uuid", (col) => col.notNull().references("users.id"))
    .addColumn("last_edited_by", "uuid", (col) => col.notNull().references("users.id"))
    .addColumn("submitted_by", "uuid", (col) => col.references("users.id"))
    .addColumn("submitted_at", "timestamptz")
    .addColumn("decided_by", "uuid", (col) => col.references("users.id"))
    .addColumn("decided_at", "timestamptz")
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addColumn("updated_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint("design_revisions_number_key", ["design_id", "number"])
    .addCheckConstraint(
      "design_revisions_status_known",
      sql`status in ('draft', 'in_review', 'returned', 'approved')`,
    )
    .execute();
  await db.schema
    .createIndex("design_revisions_org_status_idx")
    .on("design_revisions")
    .columns(["organization_id", "status"])
    .execute();

  await sql`
    create function refuse_change_to_approved_revision() returns trigger language plpgsql as $$
    begin
      if old.status = 'approved' then
        raise exception 'revision % of design % is approved and cannot change', old.number, old.design_id
          using errcode = 'check_violation';
      end if;
      return case when tg_op = 'DELETE' then old else new end;
    end $$`.execute(db);
  await sql`
    create trigger design_revisions_frozen_when_approved
    before update or delete on design_revisions
    for each row execute function refuse_change_to_approved_revision()`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("design_revisions").execute();
  await sql`drop function if exists refuse_change_to_approved_revision()`.execute(db);
  await db.schema.dropTable("designs").execute();
}
