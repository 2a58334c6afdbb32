import { Kysely, PostgresDialect, sql, type Transaction } from "kysely";
import pg from "pg";
import type { Database } from "@/db/types";

// The integration suites talk to the real PostgreSQL that scripts/test.sh starts (a throw-away
// cluster, database sealpitch_test). No mocks. getTestDb() connects as the app's runtime role
// (DATABASE_URL), so every suite also proves the app needs no more than that role's grants;
// getOwnerTestDb() connects as the owner role (MIGRATION_DATABASE_URL), only for what the app may
// never do: emptying tables, switching a guard trigger off to clean up approved revisions, DDL.
let instance: Kysely<Database> | undefined;
let owner: Kysely<Database> | undefined;

function connect(url: string | undefined, name: string): Kysely<Database> {
  if (!url) throw new Error(`${name} is not set: run the integration tests through \`npm test\`.`);
  return new Kysely<Database>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: url, max: 4 }) }),
  });
}

export function getTestDb(): Kysely<Database> {
  instance ??= connect(process.env.DATABASE_URL, "DATABASE_URL");
  return instance;
}

export function getOwnerTestDb(): Kysely<Database> {
  owner ??= connect(process.env.MIGRATION_DATABASE_URL, "MIGRATION_DATABASE_URL");
  return owner;
}

/** Empties every application table (keeps the migration bookkeeping and app_meta); as the owner. */
export async function clearTables(db: Kysely<Database> = getOwnerTestDb()): Promise<void> {
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

/**
 * A suite's clean-up of its own designs: approved revisions refuse DELETE (by design), so this runs
 * as the owner with that trigger off inside one transaction, and nobody else ever sees it disabled.
 */
export async function deleteWithFrozenGuardOff(
  body: (trx: Transaction<Database>) => Promise<void>,
): Promise<void> {
  await getOwnerTestDb()
    .transaction()
    .execute(async (trx) => {
      await sql`alter table design_revisions disable trigger design_revisions_frozen_when_approved`.execute(
        trx,
      );
      await body(trx);
      await sql`alter table design_revisions enable trigger design_revisions_frozen_when_approved`.execute(
        trx,
      );
    });
}
