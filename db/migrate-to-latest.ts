import { type Kysely, Migrator } from "kysely";
import { ProjectMigrationProvider } from "./migration-provider";

export interface MigrationReport {
  applied: string[];
  latest: string | null;
}

/** Runs every pending migration and records the newest one in app_meta. Throws on failure. */
export async function migrateToLatest(db: Kysely<any>): Promise<MigrationReport> {
  const migrator = new Migrator({ db, provider: new ProjectMigrationProvider() });
  const { error, results = [] } = await migrator.migrateToLatest();
  const failed = results.find((result) => result.status === "Error");
  if (error || failed) {
    const name = failed ? ` in ${failed.migrationName}` : "";
    const reason = error instanceof Error ? error.message : String(error ?? "unknown error");
    throw new Error(`Migration failed${name}: ${reason}`);
  }
  const all = await migrator.getMigrations();
  const latest = all.filter((m) => m.executedAt).at(-1)?.name ?? null;
  if (latest) {
    await db
      .insertInto("app_meta")
      .values({ id: 1, schema_version: latest })
      .onConflict((oc) => oc.column("id").doUpdateSet({ schema_version: latest, updated_at: new Date() }))
      .execute();
  }
  return { applied: results.filter((r) => r.status === "Success").map((r) => r.migrationName), latest };
}
