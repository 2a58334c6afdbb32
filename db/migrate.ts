// `npm run db:migrate`: applies pending migrations to DATABASE_URL, prints each, exits non-zero
// with a one-line reason on failure. Run by scripts/start.sh and scripts/test.sh.
import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import { parseEnvKeys } from "@/server/env";
import { migrateToLatest } from "./migrate-to-latest";

async function main(): Promise<void> {
  const { DATABASE_URL } = parseEnvKeys(["DATABASE_URL"]);
  const db = new Kysely<any>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: DATABASE_URL, max: 1 }) }),
  });
  try {
    const report = await migrateToLatest(db);
    for (const name of report.applied) console.log(`migrated: ${name}`);
    console.log(`schema is at ${report.latest ?? "(empty)"}`);
  } finally {
    await db.destroy();
  }
}

main().catch((error: unknown) => {
  console.error(`sealpitch: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
