import { readdir } from "node:fs/promises";
import path from "node:path";
import { pathToFileURL } from "node:url";
import type { Migration, MigrationProvider } from "kysely";

export const MIGRATIONS_DIR = path.resolve(process.cwd(), "migrations");

/**
 * Kysely's FileMigrationProvider imports `.ts` files with a bare dynamic import that fails under
 * vitest; this one imports each file through a file URL, which works under tsx, vitest and Node.
 */
export class ProjectMigrationProvider implements MigrationProvider {
  constructor(private readonly folder: string = MIGRATIONS_DIR) {}

  async getMigrations(): Promise<Record<string, Migration>> {
    const migrations: Record<string, Migration> = {};
    for (const name of await listMigrationNames(this.folder)) {
      const module = (await import(pathToFileURL(path.join(this.folder, `${name}.ts`)).href)) as Migration;
      migrations[name] = { up: module.up, down: module.down };
    }
    return migrations;
  }
}

/** Migration names (file names without `.ts`), oldest first. */
export async function listMigrationNames(folder: string = MIGRATIONS_DIR): Promise<string[]> {
  const files = await readdir(folder);
  return files
    .filter((file) => /^\d{4}_\d{2}_\d{2}_\d{6}_[a-z0-9_]+\.ts$/.test(file))
    .map((file) => file.replace(/\.ts$/, ""))
    .sort();
}
