import { execFileSync } from "node:child_process";
import { mkdirSync, readdirSync, rmSync } from "node:fs";
import path from "node:path";
import { randomUUID } from "node:crypto";
import { Migrator, sql } from "kysely";
import { afterAll, describe, expect, it } from "vitest";
import { migrateToLatest } from "@/db/migrate-to-latest";
import { listMigrationNames, MIGRATIONS_DIR } from "@/db/migration-names";
import { ProjectMigrationProvider } from "@/db/migration-provider";
import { getHealth } from "@/features/health/queries";
import { seedAccounts } from "../../scripts/seed/accounts";
import { seedDesigns } from "../../scripts/seed/designs";
import { createScratchDatabase, type ScratchDatabase } from "./ops-db";

// Upgrade safety, on scratch databases of the test cluster:
// - every migration can be undone: up to the newest, down one at a time to nothing, up again;
//   a migration that cannot be undone must say so (`export const irreversible = "<reason>"`);
// - the previous release's schema, rebuilt from git (the migrations folder as it was just before
//   the newest migration landed, taken with `git archive`), seeded with the demo data, migrates
//   to the current schema with every row intact.
const scratch: ScratchDatabase[] = [];
const folders: string[] = [];
afterAll(async () => {
  for (const database of scratch) await database.drop();
  for (const folder of folders) rmSync(folder, { recursive: true, force: true });
});

async function publicTables(database: ScratchDatabase): Promise<string[]> {
  const { rows } = await sql<{ name: string }>`
    select table_name as name from information_schema.tables
    where table_schema = 'public' and table_name not like 'kysely_migration%' order by 1`.execute(
    database.db,
  );
  return rows.map((row) => row.name);
}

function git(args: string[]): string {
  return execFileSync("git", args, { cwd: process.cwd(), encoding: "utf8" }).trim();
}

describe("migrations", () => {
  it("every migration has a down, or says why it cannot have one", async () => {
    for (const name of await listMigrationNames()) {
      const migration = (await import(path.join(MIGRATIONS_DIR, `${name}.ts`))) as {
        down?: unknown;
        irreversible?: unknown;
      };
      const reason = typeof migration.irreversible === "string" ? migration.irreversible.trim() : "";
      expect(
        typeof migration.down === "function" || reason.length > 10,
        `${name} has no down and no reason`,
      ).toBe(true);
    }
  });

  it("runs up, then down one by one to an empty schema, then up again", async () => {
    const database = await createScratchDatabase("updown");
    scratch.push(database);
    const all = await listMigrationNames();
    expect((await migrateToLatest(database.db)).applied).toEqual(all);
    const tablesAtLatest = await publicTables(database);
    const migrator = new Migrator({ db: database.db, provider: new ProjectMigrationProvider() });
    for (const name of [...all].reverse()) {
      const migration = (await import(path.join(MIGRATIONS_DIR, `${name}.ts`))) as { irreversible?: unknown };
      if (typeof migration.irreversible === "string") break; // nothing older can be undone past it
      const { error, results } = await migrator.migrateDown();
      expect(error, `down of ${name}`).toBeUndefined();
      expect(results?.map((r) => [r.migrationName, r.status])).toEqual([[name, "Success"]]);
    }
    expect(await publicTables(database)).toEqual([]);
    expect((await migrateToLatest(database.db)).applied).toEqual(all);
    expect(await publicTables(database)).toEqual(tablesAtLatest);
  });

  it("upgrades the previous release's schema, seeded, to the current one without losing a row", async () => {
    // The newest commit that changed migrations/, and the tree just before it.
    const newestChange = git(["log", "-1", "--format=%H", "--", "migrations"]);
    expect(newestChange).toMatch(/^[0-9a-f]{40}$/);
    const previous = git(["rev-parse", `${newestChange}^`]);
    // Inside the project, so the old migrations resolve `kysely` from node_modules.
    const folder = path.join(process.cwd(), "node_modules", ".cache", `sealpitch-previous-${randomUUID()}`);
    folders.push(folder);
    mkdirSync(folder, { recursive: true });
    execFileSync("sh", ["-c", `git archive ${previous} migrations | tar -x -C "${folder}"`], {
      cwd: process.cwd(),
    });
    const oldFolder = path.join(folder, "migrations");
    const oldNames = await listMigrationNames(oldFolder);
    const currentNames = await listMigrationNames();
    expect(oldNames.length).toBeGreaterThan(0);
    // The old release is a strict prefix of today's history (landed migrations are never edited).
    expect(currentNames.slice(0, oldNames.length)).toEqual(oldNames);
    expect(currentNames.length).toBeGreaterThan(oldNames.length);
    for (const name of oldNames) {
      expect(execFileSync("git", ["show", `${previous}:migrations/${name}.ts`], { encoding: "utf8" })).toBe(
        execFileSync("git", ["show", `HEAD:migrations/${name}.ts`], { encoding: "utf8" }),
      );
    }
    expect(readdirSync(oldFolder).length).toBe(oldNames.length);

    const database = await createScratchDatabase("upgrade");
    scratch.push(database);
    const old = new Migrator({ db: database.db, provider: new ProjectMigrationProvider(oldFolder) });
    const built = await old.migrateToLatest();
    expect(built.error).toBeUndefined();
    const { organizationId } = await seedAccounts(database.db);
    await seedDesigns(database.db, organizationId);
    const snapshot = async () => ({
      organizations: await database.db
        .selectFrom("organizations")
        .select(["id", "name"])
        .orderBy("id")
        .execute(),
      users: await database.db
        .selectFrom("users")
        .select(["id", "email", "password_hash"])
        .orderBy("id")
        .execute(),
      designs: await database.db
        .selectFrom("designs")
        .select(["id", "name", "equipment_tag"])
        .orderBy("id")
        .execute(),
      revisions: await database.db
        .selectFrom("design_revisions")
        .select(["id", "number", "status", "version", "document", "content_hash"])
        .orderBy("id")
        .execute(),
    });
    const before = await snapshot();
    expect(before.designs.length).toBeGreaterThan(0);

    const upgraded = await migrateToLatest(database.db);
    expect(upgraded.applied).toEqual(currentNames.slice(oldNames.length));
    expect(await snapshot()).toEqual(before);
    expect(await getHealth(database.db)).toMatchObject({ ok: true, migrations: currentNames.length });
  });
});
