// `npm run db:seed`: the demo data (idempotent: running it again changes nothing that exists).
// Prints the demo sign-ins, which `npm start` shows.
import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import type { Database } from "@/db/types";
import { parseEnvKeys } from "@/server/env";
import { DEMO_ORGANIZATION, DEMO_PASSWORD, DEMO_USERS, seedAccounts } from "./seed/accounts";
import { seedDesigns } from "./seed/designs";

async function main(): Promise<void> {
  const { DATABASE_URL } = parseEnvKeys(["DATABASE_URL"]);
  const db = new Kysely<Database>({
    dialect: new PostgresDialect({ pool: new pg.Pool({ connectionString: DATABASE_URL, max: 2 }) }),
  });
  try {
    const { organizationId } = await seedAccounts(db);
    const designs = await seedDesigns(db, organizationId);
    if (designs.created.length > 0) console.log(`  Joint register: added ${designs.created.join(", ")}`);
    console.log(
      `  Demo organisation: ${DEMO_ORGANIZATION.name} (password for every demo sign-in: ${DEMO_PASSWORD})`,
    );
    for (const user of DEMO_USERS) console.log(`    ${user.roles.join(" + ").padEnd(20)} ${user.email}`);
  } finally {
    await db.destroy();
  }
}

main().catch((error: unknown) => {
  console.error(`sealpitch: seeding failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
