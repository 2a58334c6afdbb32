import { type Kysely, sql } from "kysely";

// Files made by background export jobs (the bolt-spacing sheet of a large flange). The app is
// stateless, so the job's progress and the finished bytes live here; the job queue itself is
// pg-boss in its own schema. The row id is also the pg-boss job id and the id in the URL.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("export_files")
    .addColumn("id", "uuid", (col) => col.primaryKey().defaultTo(sql`gen_random_uuid()`))
    .addColumn("organization_id", "uuid", (col) =>
      col.notNull().references("organizations.id").onDelete("cascade"),
    )
    .addColumn("design_id", "uuid", (col) => col.notNull().references("designs.id").onDelete("cascade"))
    .addColumn("revision_id", "uuid", (col) =>
      col.notNull().references("design_revisions.id").onDelete("cascade"),
    )
    .addColumn("kind", "text", (col) => col.notNull())
    .addColumn("options", "jsonb", (col) => col.notNull().defaultTo(sql`'{}'::jsonb`))
    .addColumn("status", "text", (col) => col.notNull().defaultTo("queued"))
    .addColumn("progress", "integer", (col) => col.notNull().defaultTo(0))
    .addColumn("file_name", "text", (col) => col.notNull())
    .addColumn("content_type", "text", (col) => col.notNull())
    .addColumn("bytes", "bytea")
    .addColumn("byte_size", "integer")
    .addColumn("error", "text")
    .addColumn("requested_by", "uuid", (col) => col.references("users.id").onDelete("set null"))
    .addColumn("created_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addColumn("updated_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .addColumn("finished_at", "timestamptz")
    .addCheckConstraint("export_files_status_known", sql`status in ('queued', 'running', 'done', 'failed')`)
    .addCheckConstraint("export_files_progress_range", sql`progress between 0 and 100`)
    .execute();
  await db.schema
    .createIndex("export_files_org_created_idx")
    .on("export_files")
    .columns(["organization_id", "created_at"])
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("export_files").execute();
}
