import "server-only";
import { sql } from "kysely";
import type { Db } from "@/db/index";
import { listMigrationNames } from "@/db/migration-names";

export type HealthReport =
  { ok: true; schemaVersion: string; migrations: number } | { ok: false; reason: string };

/** Is the database reachable, and has every migration file in migrations/ been applied? */
export async function getHealth(db: Db): Promise<HealthReport> {
  let applied: string[];
  try {
    const rows = await sql<{ name: string }>`select name from kysely_migration order by name`.execute(db);
    applied = rows.rows.map((row) => row.name);
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    if (/kysely_migration/.test(message)) return { ok: false, reason: "database has not been migrated" };
    return { ok: false, reason: `database unreachable: ${message}` };
  }
  const expected = await listMigrationNames();
  const pending = expected.filter((name) => !applied.includes(name));
  if (pending.length > 0) return { ok: false, reason: `migrations pending: ${pending.join(", ")}` };
  const meta = await db.selectFrom("app_meta").select("schema_version").executeTakeFirst();
  return { ok: true, schemaVersion: meta?.schema_version ?? "unknown", migrations: applied.length };
}
