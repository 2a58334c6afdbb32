import { type Kysely, sql } from "kysely";

// A single row that records which schema the database is on. db/migrate.ts writes the name of
// the newest applied migration here after every successful run.
export async function up(db: Kysely<any>): Promise<void> {
  await db.schema
    .createTable("app_meta")
    .addColumn("id", "smallint", (col) =>
      col
        .primaryKey()
        .defaultTo(1)
        .check(sql`id = 1`),
    )
    .addColumn("schema_version", "text", (col) => col.notNull())
    .addColumn("updated_at", "timestamptz", (col) => col.notNull().defaultTo(sql`now()`))
    .execute();
  await db
    .insertInto("app_meta")
    .values({ id: 1, schema_version: "2026_12_01_000100_create_app_meta" })
    .execute();
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("app_meta").execute();
}
