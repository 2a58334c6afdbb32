import { readdir } from "node:fs/promises";
import path from "node:path";

export const MIGRATIONS_DIR = path.join(process.cwd(), "migrations");

/** Migration names (file names without `.ts`), oldest first. Used by the migrator and the health check. */
export async function listMigrationNames(folder: string = MIGRATIONS_DIR): Promise<string[]> {
  // The folder is read at run time on purpose (the health check compares it with the database);
  // the ignore comment keeps the bundler from tracing the whole project because of it.
  const files = await readdir(/* turbopackIgnore: true */ folder);
  return files
    .filter((file) => /^\d{4}_\d{2}_\d{2}_\d{6}_[a-z0-9_]+\.ts$/.test(file))
    .map((file) => file.replace(/\.ts$/, ""))
    .sort();
}
