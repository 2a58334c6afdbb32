// `npm run restore -- FILE [--force]`: restores a dump written by `npm run backup` into the
// database of DATABASE_URL (the demo database of `npm start` when that is not set). The target
// should be empty (create it first: `createdb -O <owner role> NAME`). A database that holds data
// is refused unless --force is given; then the dump's objects replace the existing ones
// (pg_restore --clean). Everything runs in one transaction: a failed restore changes nothing.
// Objects end up owned by the restoring role (--no-owner); the dump's grants (e.g. to the app's
// runtime role) are restored as they were, so those roles must exist in the target cluster.
import { statSync } from "node:fs";
import path from "node:path";
import pg from "pg";
import { parseEnvKeys } from "@/server/env";
import { describeUrl, formatBytes, libpqEnv, runPgTool, withDemoDatabase } from "./lib/pg-tools";

export interface TargetState {
  tables: number;
  /** Tables of the app (schema public, migration bookkeeping aside) that hold at least one row. */
  tablesWithRows: string[];
}

export async function inspectTarget(url: string): Promise<TargetState> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const tables = await client.query<{ schema: string; name: string }>(
      `select table_schema as schema, table_name as name from information_schema.tables
       where table_type = 'BASE TABLE' and table_schema not in ('pg_catalog', 'information_schema')`,
    );
    const withRows: string[] = [];
    for (const table of tables.rows) {
      if (table.schema !== "public" || /^kysely_migration|^app_meta$/.test(table.name)) continue;
      const ident = `"${table.schema}"."${table.name.replace(/"/g, '""')}"`;
      const { rows } = await client.query<{ any: boolean }>(`select exists (select 1 from ${ident}) as any`);
      if (rows[0]?.any) withRows.push(table.name);
    }
    return { tables: tables.rows.length, tablesWithRows: withRows };
  } finally {
    await client.end();
  }
}

export class RestoreRefused extends Error {
  override name = "RestoreRefused";
}

export async function restore(
  url: string,
  file: string,
  options: { force: boolean },
): Promise<{ seconds: number; replaced: boolean }> {
  statSync(file); // a clear ENOENT before anything touches the database
  const started = performance.now();
  const state = await inspectTarget(url);
  if (state.tablesWithRows.length > 0 && !options.force) {
    const shown = state.tablesWithRows.slice(0, 5).join(", ");
    throw new RestoreRefused(
      `${describeUrl(url)} already holds data (${shown}${state.tablesWithRows.length > 5 ? ", …" : ""}); ` +
        "restore into an empty database, or pass --force to replace its contents",
    );
  }
  const replace = state.tables > 0;
  const database = libpqEnv(url).PGDATABASE;
  if (!database) throw new Error("DATABASE_URL names no database");
  await runPgTool(
    "pg_restore",
    [
      `--dbname=${database}`,
      "--no-password",
      "--no-owner",
      "--single-transaction",
      "--exit-on-error",
      ...(replace ? ["--clean", "--if-exists"] : []),
      file,
    ],
    url,
  );
  return { seconds: (performance.now() - started) / 1000, replaced: replace };
}

async function main(): Promise<void> {
  const args = process.argv.slice(2);
  const force = args.includes("--force");
  const files = args.filter((arg) => arg !== "--force");
  if (files.length !== 1 || files[0]!.startsWith("-"))
    throw new Error("usage: npm run restore -- FILE [--force]");
  const { DATABASE_URL: url } = parseEnvKeys(["DATABASE_URL"], withDemoDatabase(process.env));
  const file = path.resolve(files[0]!);
  const { seconds, replaced } = await restore(url, file, { force });
  console.log(
    `restored ${file} (${formatBytes(statSync(file).size)}) into ${describeUrl(url)}` +
      `${replaced ? ", replacing what was there" : ""} in ${seconds.toFixed(1)} s`,
  );
  console.log("run `npm run db:migrate` if this code is newer than the backup's schema");
}

main().catch((error: unknown) => {
  console.error(
    `sealpitch: restore ${error instanceof RestoreRefused ? "refused" : "failed"}: ${
      error instanceof Error ? error.message : String(error)
    }`,
  );
  process.exit(error instanceof RestoreRefused ? 2 : 1);
});
