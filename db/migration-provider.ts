import path from "node:path";
import { pathToFileURL } from "node:url";
import type { Migration, MigrationProvider } from "kysely";
import { listMigrationNames, MIGRATIONS_DIR } from "./migration-names";

/**
 * Kysely's FileMigrationProvider imports `.ts` files with a bare dynamic import that fails under
 * vitest; this one imports each file through a file URL, which works under tsx, vitest and Node.
 */
export class ProjectMigrationProvider implements MigrationProvider {
  constructor(private readonly folder: string = MIGRATIONS_DIR) {}

  async getMigrations(): Promise<Record<string, Migration>> {
    const migrations: Record<string, Migration> = {};
    for (const name of await listMigrationNames(this.folder)) {
      const migration = (await import(pathToFileURL(path.join(this.folder, `${name}.ts`)).href)) as Migration;
      migrations[name] = { up: migration.up, down: migration.down };
    }
    return migrations;
  }
}
