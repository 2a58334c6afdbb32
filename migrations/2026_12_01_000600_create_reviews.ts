import { type Kysely, sql } from "kysely";

// Review and approval: comments, decisions, justifications of warn/fail checks, and the design
// activity log. The history tables are append-only: a trigger refuses UPDATE and any DELETE that
// is not a cascade from deleting the whole organisation, design or revision (pg_trigger_depth() > 1
// inside a foreign-key cascade), so a record of who did what can only go together with its design.
// design_revisions also gets two database-level guards beside the app's own checks: the status may
// only move along the review state machine, and an approval must be decided by someone other
// than the revision's creator, last editor and submitter (the four-eyes rule).
export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create function refuse_change_to_history_row() returns trigger language plpgsql as $$
    begin
      if tg_op = 'DELETE' and pg_trigger_depth() > 1 then
        return old;
      end if;
      raise exception '% is append-only: % refused', tg_table_name, lower(tg_op)
        using errcode = 'check_violation';
    end $$`.execute(db);

  await db.schema
    .createTable("revision_comments")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("revision_id", "uuid", (col) =>
      col.notNull().references("design_revisions.id").onDelete("cascade"),
    )
    .addColumn("organization_id", "uuid", (col) =>
      col.notNull().references("organizations.id").onDelete("cascade"),
    )
    .addColumn("author_id", "uuid", (col) => col.notNull().references("users.id"))
    .addColumn("body", "text", (col) => col.notNull())
    .addColumn("target_kind", "text")
    .addColumn("target_id", "text")
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addCheckConstraint("revision_comments_body_present", sql`length(btrim(body)) > 0`)
    .addCheckConstraint(
      "revision_comments_target_pair",
      sql`(target_kind is null and target_id is null) or (target_kind in ('bolt', 'check') and target_id is not null)`,
    )
    .execute();
  await db.schema
    .createIndex("revision_comments_revision_idx")
    .on("revision_comments")
    .columns(["revision_id", "created_at"])
    .execute();

  await db.schema
    .createTable("revision_decisions")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("revision_id", "uuid", (col) =>
      col.notNull().references("design_revisions.id").onDelete("cascade"),
    )
    .addColumn("organization_id", "uuid", (col) =>
      col.notNull().references("organizations.id").onDelete("cascade"),
    )
    .addColumn("kind", "text", (col) => col.notNull().check(sql`kind in ('approved', 'returned')`))
    .addColumn("actor_id", "uuid", (col) => col.notNull().references("users.id"))
    .addColumn("comment", "text", (col) => col.notNull().defaultTo(""))
    .addColumn("content_hash", "text", (col) => col.notNull())
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addCheckConstraint(
      "revision_decisions_return_has_comment",
      sql`kind <> 'returned' or length(btrim(comment)) > 0`,
    )
    .execute();
  await db.schema
    .createIndex("revision_decisions_revision_idx")
    .on("revision_decisions")
    .columns(["revision_id", "created_at"])
    .execute();

  await db.schema
    .createTable("revision_justifications")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("revision_id", "uuid", (col) =>
      col.notNull().references("design_revisions.id").onDelete("cascade"),
    )
    .addColumn("organization_id", "uuid", (col) =>
      col.notNull().references("organizations.id").onDelete("cascade"),
    )
    .addColumn("check_id", "text", (col) => col.notNull())
    .addColumn("check_status", "text", (col) => col.notNull().check(sql`check_status in ('warn', 'fail')`))
    .addColumn("text", "text", (col) => col.notNull())
    .addColumn("author_id", "uuid", (col) => col.notNull().references("users.id"))
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addUniqueConstraint("revision_justifications_check_key", ["revision_id", "check_id"])
    .addCheckConstraint("revision_justifications_text_present", sql`length(btrim(text)) > 0`)
    .execute();

  await db.schema
    .createTable("design_activity")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("organization_id", "uuid", (col) =>
      col.notNull().references("organizations.id").onDelete("cascade"),
    )
    .addColumn("design_id", "uuid", (col) => col.notNull().references("designs.id").onDelete("cascade"))
    .addColumn("revision_id", "uuid", (col) => col.references("design_revisions.id").onDelete("cascade"))
    .addColumn("actor_id", "uuid", (col) => col.notNull().references("users.id"))
    .addColumn("kind", "text", (col) =>
      col
        .notNull()
        .check(
          sql`kind in ('created', 'saved', 'submitted', 'returned', 'approved', 'new-revision', 'commented', 'exported')`,
        ),
    )
    .addColumn("detail", "text", (col) => col.notNull().defaultTo(""))
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`clock_timestamp()`))
    .execute();
  await db.schema
    .createIndex("design_activity_design_idx")
    .on("design_activity")
    .columns(["design_id", "created_at"])
    .execute();

  for (const table of [
    "revision_comments",
    "revision_decisions",
    "revision_justifications",
    "design_activity",
  ]) {
    await sql`
      create trigger ${sql.raw(`${table}_append_only`)}
      before update or delete on ${sql.table(table)}
      for each row execute function refuse_change_to_history_row()`.execute(db);
  }

  await sql`
    create function refuse_skipped_review_step() returns trigger language plpgsql as $$
    begin
      if new.status is distinct from old.status and not (
        (old.status in ('draft', 'returned') and new.status = 'in_review') or
        (old.status = 'in_review' and new.status in ('approved', 'returned'))
      ) then
        raise exception 'revision % of design % cannot go from % to %', old.number, old.design_id, old.status, new.status
          using errcode = 'check_violation';
      end if;
      return new;
    end $$`.execute(db);
  await sql`
    create trigger design_revisions_review_steps
    before update of status on design_revisions
    for each row execute function refuse_skipped_review_step()`.execute(db);

  await sql`
    alter table design_revisions add constraint design_revisions_four_eyes check (
      status <> 'approved' or (
        decided_by is not null and decided_by <> created_by and decided_by <> last_edited_by
        and decided_by is distinct from submitted_by
      )
    )`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table design_revisions drop constraint if exists design_revisions_four_eyes`.execute(db);
  await sql`drop trigger if exists design_revisions_review_steps on design_revisions`.execute(db);
  await sql`drop function if exists refuse_skipped_review_step()`.execute(db);
  for (const table of [
    "design_activity",
    "revision_justifications",
    "revision_decisions",
    "revision_comments",
  ]) {
    await db.schema.dropTable(table).ifExists().execute();
  }
  await sql`drop function if exists refuse_change_to_history_row()`.execute(db);
}
