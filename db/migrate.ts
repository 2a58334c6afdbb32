// `npm run db:migrate`: as the owner role (MIGRATION_DATABASE_URL, else DATABASE_URL), applies
// pending migrations, installs or updates the job queue's schema and queues, and re-applies the
// runtime role's grants (db/runtime-grants.ts). Prints each migration; exits non-zero with a
// one-line reason on failure. Run by scripts/start.sh and scripts/test.sh.
import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import PgBoss from "pg-boss";
import { installQueues } from "./job-queues";
import { parseEnvKeys } from "@/server/env";
import { migrateToLatest } from "./migrate-to-latest";
import { applyRuntimeGrants } from "./runtime-grants";

async function main(): Promise<void> {
  const env = parseEnvKeys(["DATABASE_URL", "MIGRATION_DATABASE_URL"]);
  const connectionString = env.MIGRATION_DATABASE_URL ?? env.DATABASE_URL;
  const db = new Kysely<any>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString, max: 1 }) }),
  });
  try {
    const report = await migrateToLatest(db);
    for (const name of report.applied) console.log(`migrated: ${name}`);
    console.log(`schema is at ${report.latest ?? "(empty)"}`);
    const boss = new PgBoss({ connectionString, max: 1, supervise: false, schedule: false, migrate: true });
    boss.on("error", (error: Error) => console.error(`sealpitch: job queue: ${error.message}`));
    await boss.start();
    try {
      await installQueues(boss);
    } finally {
      await boss.stop({ graceful: false, wait: true });
    }
    await applyRuntimeGrants(db);
  } finally {
    await db.destroy();
  }
}

main().catch((error: unknown) => {
  console.error(`sealpitch: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
