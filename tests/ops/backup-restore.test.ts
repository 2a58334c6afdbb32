import { createHash } from "node:crypto";
import { mkdtempSync, rmSync, statSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import type { Kysely } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Database } from "@/db/types";
import { migrateToLatest } from "@/db/migrate-to-latest";
import { verifySnapshot } from "@/features/analysis/content-hash";
import { generateOrganisation } from "../../scripts/generate-org";
import { createScratchDatabase, runScript, type ScratchDatabase } from "./ops-db";

// `npm run backup` and `npm run restore` round trip: a generated organisation (designs,
// attachments, approved revisions, finished spacing sheets) is dumped with the real pg_dump and
// restored with the real pg_restore into a fresh database of the same cluster; every approved
// snapshot's content hash still verifies and every stored file comes back byte for byte.
let source: ScratchDatabase;
let target: ScratchDatabase;
let folder: string;
let dumpFile: string;

async function approvedRevisions(db: Kysely<Database>) {
  return db
    .selectFrom("design_revisions")
    .select(["id", "document", "result", "core_version", "content_hash"])
    .where("status", "=", "approved")
    .orderBy("id")
    .execute();
}

async function attachmentBytes(db: Kysely<Database>) {
  return db
    .selectFrom("design_attachments")
    .innerJoin("blobs", "blobs.id", "design_attachments.blob_id")
    .select(["design_attachments.id", "design_attachments.sha256", "blobs.bytes"])
    .orderBy("design_attachments.id")
    .execute();
}

async function sheetBytes(db: Kysely<Database>) {
  return db
    .selectFrom("export_files")
    .select(["id", "bytes", "byte_size"])
    .where("status", "=", "done")
    .orderBy("id")
    .execute();
}

beforeAll(async () => {
  folder = mkdtempSync(path.join(tmpdir(), "sealpitch-backup-"));
  dumpFile = path.join(folder, "sealpitch.dump");
  source = await createScratchDatabase("bksrc");
  target = await createScratchDatabase("bkdst");
  await migrateToLatest(source.db);
  const made = await generateOrganisation(source.db, { designs: 4, attachmentKb: 24, approveEvery: 2 });
  expect(made).toMatchObject({ designs: 4, attachments: 4, approved: 2, sheets: 2 });
}, 120_000);

afterAll(async () => {
  await source?.drop();
  await target?.drop();
  if (folder) rmSync(folder, { recursive: true, force: true });
});

describe("backup and restore", () => {
  it("writes a custom-format dump and prints its size and duration", async () => {
    const run = await runScript("backup.ts", [dumpFile], source.url);
    expect(run.stderr).toBe("");
    expect(run.code).toBe(0);
    expect(run.stdout).toMatch(/written to .*sealpitch\.dump: [\d.]+ (B|kB|MB) in [\d.]+ s/);
    // The password is never printed.
    expect(run.stdout).not.toContain(new URL(source.url).password);
    const head = Buffer.alloc(5);
    const { openSync, readSync, closeSync } = await import("node:fs");
    const fd = openSync(dumpFile, "r");
    readSync(fd, head, 0, 5, 0);
    closeSync(fd);
    expect(head.toString("latin1")).toBe("PGDMP"); // pg_dump's custom format signature
    expect(statSync(dumpFile).size).toBeGreaterThan(4 * 24 * 1024); // the attachments are in it
  });

  it("restores into an empty database: snapshots verify, files are byte-identical", async () => {
    const run = await runScript("restore.ts", [dumpFile], target.url);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stdout).toMatch(/restored .* in [\d.]+ s/);

    const before = await approvedRevisions(source.db);
    const after = await approvedRevisions(target.db);
    expect(after.map((r) => r.id)).toEqual(before.map((r) => r.id));
    expect(after).toHaveLength(2);
    for (const revision of after) {
      const integrity = verifySnapshot({
        document: revision.document,
        result: revision.result,
        coreVersion: revision.core_version,
        contentHash: revision.content_hash,
      });
      expect(integrity.state, revision.id).toBe("intact");
    }

    const filesBefore = await attachmentBytes(source.db);
    const filesAfter = await attachmentBytes(target.db);
    expect(filesAfter).toHaveLength(4);
    expect(filesAfter.map((f) => f.id)).toEqual(filesBefore.map((f) => f.id));
    filesAfter.forEach((file, i) => {
      expect(Buffer.compare(file.bytes, filesBefore[i]!.bytes)).toBe(0);
      expect(createHash("sha256").update(file.bytes).digest("hex")).toBe(file.sha256);
    });

    const sheetsBefore = await sheetBytes(source.db);
    const sheetsAfter = await sheetBytes(target.db);
    expect(sheetsAfter).toHaveLength(2);
    sheetsAfter.forEach((sheet, i) => {
      expect(sheet.bytes!.subarray(0, 5).toString("latin1")).toBe("%PDF-");
      expect(sheet.byte_size).toBe(sheet.bytes!.length);
      expect(Buffer.compare(sheet.bytes!, sheetsBefore[i]!.bytes!)).toBe(0);
    });

    // The restored database is at the same schema and the migrator finds nothing to do.
    expect((await migrateToLatest(target.db)).applied).toEqual([]);
  });

  it("refuses to restore over a database holding data, and replaces it with --force", async () => {
    const marker = await target.db
      .insertInto("organizations")
      .values({ name: "Written after the backup", slug: "after-backup" })
      .returning("id")
      .executeTakeFirstOrThrow();
    const refused = await runScript("restore.ts", [dumpFile], target.url);
    expect(refused.code).toBe(2);
    expect(refused.stderr).toMatch(/already holds data .*--force/);
    expect(
      await target.db.selectFrom("organizations").where("id", "=", marker.id).select("id").execute(),
    ).toHaveLength(1);

    const forced = await runScript("restore.ts", [dumpFile, "--force"], target.url);
    expect(forced.code, forced.stderr).toBe(0);
    expect(forced.stdout).toMatch(/replacing what was there/);
    expect(
      await target.db.selectFrom("organizations").where("id", "=", marker.id).select("id").execute(),
    ).toHaveLength(0);
    expect(await approvedRevisions(target.db)).toHaveLength(2);
  });

  it("fails with one line and leaves no file when the database cannot be reached", async () => {
    const url = new URL(source.url);
    url.pathname = "/sealpitch_test_no_such_database";
    const missing = path.join(folder, "missing.dump");
    const run = await runScript("backup.ts", [missing], url.toString());
    expect(run.code).toBe(1);
    expect(run.stderr).toMatch(/^sealpitch: backup failed: pg_dump failed/);
    expect(() => statSync(missing)).toThrow();
  });
});
