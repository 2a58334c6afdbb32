// `npm run backup -- FILE`: one consistent dump of the whole database in PostgreSQL's custom
// format (pg_dump -Fc): every schema (the app's tables, pg-boss's queue), the attachments
// (blobs.bytes) and the finished exports (export_files.bytes), which live in the database, and any
// large objects (-b). pg_dump reads everything inside one repeatable-read snapshot, so the dump is
// consistent while the app keeps running. Prints the file's size and how long it took.
// Connects with DATABASE_URL (give it the role that owns the schema), or to the demo database of
// `npm start` when that is not set.
import { renameSync, rmSync, statSync } from "node:fs";
import path from "node:path";
import { parseEnvKeys } from "@/server/env";
import { describeUrl, formatBytes, runPgTool, withDemoDatabase } from "./lib/pg-tools";

export async function backup(url: string, file: string): Promise<{ bytes: number; seconds: number }> {
  const started = performance.now();
  const partial = `${file}.partial`;
  // Written to a side file first, so a failed dump never leaves a truncated FILE behind.
  try {
    await runPgTool(
      "pg_dump",
      ["--format=custom", "--blobs", "--no-password", "--compress=6", `--file=${partial}`],
      url,
    );
  } catch (error) {
    rmSync(partial, { force: true });
    throw error;
  }
  renameSync(partial, file);
  return { bytes: statSync(file).size, seconds: (performance.now() - started) / 1000 };
}

async function main(): Promise<void> {
  const file = process.argv[2];
  if (!file || file.startsWith("-")) throw new Error("usage: npm run backup -- FILE");
  const { DATABASE_URL: url } = parseEnvKeys(["DATABASE_URL"], withDemoDatabase(process.env));
  const target = path.resolve(file);
  const { bytes, seconds } = await backup(url, target);
  console.log(
    `backup of ${describeUrl(url)} written to ${target}: ${formatBytes(bytes)} in ${seconds.toFixed(1)} s`,
  );
}

main().catch((error: unknown) => {
  console.error(`sealpitch: backup failed: ${error instanceof Error ? error.message : String(error)}`);
  process.exit(1);
});
