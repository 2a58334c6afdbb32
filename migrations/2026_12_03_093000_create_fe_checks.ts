import { type Kysely, sql } from "kysely";

// FE cross-check runs (features/fe-check): one row per run of a revision's saved document, worked
// by the "fe-check" job queue. The row holds the run's live progress and, when done, its result
// and the result's sha-256. `document_hash` is the sha-256 of the document the run solved, so a
// screen can tell a result of an earlier save from a current one.
// Frozen like the revisions they check:
// - a finished row (done, failed, cancelled) never changes, and a row an approval cites is never
//   deleted (revision_decisions.fe_check_id; "no action", so a cascade that removes both still works);
// - no new run starts on an approved revision.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("fe_checks")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("organization_id", "uuid", (col) =>
      col.notNull().references("organizations.id").onDelete("cascade"),
    )
    .addColumn("design_id", "uuid", (col) => col.notNull().references("designs.id").onDelete("cascade"))
    .addColumn("revision_id", "uuid", (col) =>
      col.notNull().references("design_revisions.id").onDelete("cascade"),
    )
    .addColumn("document_hash", "text", (col) => col.notNull())
    .addColumn("status", "text", (col) => col.notNull().defaultTo("queued"))
    .addColumn("stage", "text", (col) => col.notNull().defaultTo("Waiting for a worker"))
    .addColumn("progress", "jsonb", (col) => col.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn("result", "jsonb")
    .addColumn("result_hash", "text")
    .addColumn("error", "text")
    .addColumn("attempts", "integer", (col) => col.notNull().defaultTo(0))
    .addColumn("cancel_requested", "boolean", (col) => col.notNull().defaultTo(false))
    .addColumn("requested_by", "uuid", (col) => col.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addColumn("updated_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addColumn("started_at", "timestamptz")
    .addColumn("finished_at", "timestamptz")
    .addCheckConstraint(
      "fe_checks_status_known",
      sql`status in ('queued', 'running', 'done', 'failed', 'cancelled')`,
    )
    .addCheckConstraint(
      "fe_checks_done_has_result",
      sql`(status = 'done') = (result is not null and result_hash is not null)`,
    )
    .execute();
  await db.schema
    .createIndex("fe_checks_revision_created_idx")
    .on("fe_checks")
    .columns(["revision_id", "created_at"])
    .execute();

  await sql`
    create function guard_fe_check_row() returns trigger language plpgsql as $$
    begin
      if tg_op = 'INSERT' then
        if exists (select from design_revisions r where r.id = new.revision_id and r.status = 'approved') then
          raise exception 'revision % is approved: no new FE cross-check runs on it', new.revision_id
            using errcode = 'check_violation';
        end if;
        return new;
      end if;
      if old.status in ('done', 'failed', 'cancelled') then
        raise exception 'FE cross-check % is finished (%) and cannot change', old.id, old.status
          using errcode = 'check_violation';
      end if;
      return new;
    end $$`.execute(db);
  await sql`
    create trigger fe_checks_guard
    before insert or update on fe_checks
    for each row execute function guard_fe_check_row()`.execute(db);

  await sql`
    alter table revision_decisions
      add column fe_check_id uuid references fe_checks (id),
      add column fe_result_hash text,
      add constraint revision_decisions_fe_check_pair
        check ((fe_check_id is null) = (fe_result_hash is null))
  `.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table revision_decisions drop column if exists fe_check_id, drop column if exists fe_result_hash`.execute(
    db,
  );
  await db.schema.dropTable("fe_checks").execute();
  await sql`drop function if exists guard_fe_check_row()`.execute(db);
}
