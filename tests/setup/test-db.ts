import { Kysely, PostgresDialect, sql } from "kysely";
import pg from "pg";
import type { Database } from "@/db/types";

// The integration suites talk to the real PostgreSQL that scripts/test.sh starts (a throw-away
// cluster, database sealpitch_test). No mocks.
let instance: Kysely<Database> | undefined;

export function getTestDb(): Kysely<Database> {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set: run the integration tests through `npm test`.");
  instance ??= new Kysely<Database>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url, max: 4 }) }),
  });
  return instance;
}

/** Empties every application table (keeps the migration bookkeeping and app_meta). */
export async function clearTables(db: Kysely<Database> = getTestDb()): Promise<void> {
  const { rows } = await sql<{ tablename: string }>`
    select tablename from pg_tables
    where schemaname = 'public' and tablename not in ('kysely_migration', 'kysely_migration_lock', 'app_meta')`.execute(
    db,
  );
  if (rows.length === 0) return;
  await sql
    .raw(`truncate ${rows.map((r) => `"${r.tablename}"`).join(", ")} restart identity cascade`)
    .execute(db);
}
