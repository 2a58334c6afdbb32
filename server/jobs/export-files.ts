import "server-only";
import type { Kysely } from "kysely";
import { sql } from "kysely";
import type { Database } from "@/db/types";
import type { ExportFileStatus, SheetJobOptions } from "@/db/tables/exports";
import { isoString, isoOrNull } from "@/db/dates";

// Rows of export_files: one background export (its progress and, when done, its bytes).
// Reads filter by organisation; another organisation's job is not found.
export interface ExportJobDto {
  jobId: string;
  kind: string;
  status: ExportFileStatus;
  /** 0…100. */
  progress: number;
  fileName: string;
  /** Where the finished file is downloaded; null until done. */
  downloadUrl: string | null;
  error: string | null;
  createdAt: string;
  finishedAt: string | null;
}

export function jobDownloadUrl(jobId: string): string {
  return `/api/v1/jobs/${jobId}?download=1`;
}

export async function createExportFile(
  db: Kysely<Database>,
  row: {
    organizationId: string;
    designId: string;
    revisionId: string;
    kind: string;
    options: SheetJobOptions;
    fileName: string;
    contentType: string;
    requestedBy: string;
  },
): Promise<string> {
  const created = await db
    .insertInto("export_files")
    .values({
      organization_id: row.organizationId,
      design_id: row.designId,
      revision_id: row.revisionId,
      kind: row.kind,
      options: JSON.stringify(row.options),
      file_name: row.fileName,
      content_type: row.contentType,
      requested_by: row.requestedBy,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
  return created.id;
}

/** The job row for the worker (no organisation filter: the worker acts for the requester). */
export async function claimExportFile(db: Kysely<Database>, id: string) {
  return db
    .updateTable("export_files")
    .set({ status: "running", progress: 1, updated_at: sql`now()` })
    .where("id", "=", id)
    .where("status", "in", ["queued", "running"])
    .returning(["id", "organization_id", "design_id", "revision_id", "options", "requested_by"])
    .executeTakeFirst();
}

export async function setExportProgress(db: Kysely<Database>, id: string, progress: number): Promise<void> {
  await db
    .updateTable("export_files")
    .set({ progress: Math.max(1, Math.min(99, Math.round(progress))), updated_at: sql`now()` })
    .where("id", "=", id)
    .where("status", "=", "running")
    .execute();
}

export async function finishExportFile(db: Kysely<Database>, id: string, bytes: Buffer): Promise<void> {
  await db
    .updateTable("export_files")
    .set({
      status: "done",
      progress: 100,
      bytes,
      byte_size: bytes.length,
      error: null,
      updated_at: sql`now()`,
      finished_at: sql`now()`,
    })
    .where("id", "=", id)
    .execute();
}

export async function failExportFile(db: Kysely<Database>, id: string, message: string): Promise<void> {
  await db
    .updateTable("export_files")
    .set({ status: "failed", error: message.slice(0, 500), updated_at: sql`now()`, finished_at: sql`now()` })
    .where("id", "=", id)
    .execute();
}

export async function findExportJob(
  db: Kysely<Database>,
  organizationId: string,
  id: string,
): Promise<ExportJobDto | undefined> {
  const row = await db
    .selectFrom("export_files")
    .select(["id", "kind", "status", "progress", "file_name", "error", "created_at", "finished_at"])
    .where("organization_id", "=", organizationId)
    .where("id", "=", id)
    .executeTakeFirst();
  if (!row) return undefined;
  return {
    jobId: row.id,
    kind: row.kind,
    status: row.status,
    progress: row.progress,
    fileName: row.file_name,
    downloadUrl: row.status === "done" ? jobDownloadUrl(row.id) : null,
    error: row.error,
    createdAt: isoString(row.created_at),
    finishedAt: isoOrNull(row.finished_at),
  };
}

export async function findExportFileBytes(
  db: Kysely<Database>,
  organizationId: string,
  id: string,
): Promise<{ fileName: string; contentType: string; bytes: Buffer } | undefined> {
  const row = await db
    .selectFrom("export_files")
    .select(["file_name", "content_type", "bytes"])
    .where("organization_id", "=", organizationId)
    .where("id", "=", id)
    .where("status", "=", "done")
    .executeTakeFirst();
  if (!row || !row.bytes) return undefined;
  return { fileName: row.file_name, contentType: row.content_type, bytes: row.bytes };
}

/**
 * Marks a queued or running export failed (a finished or already failed one is left as it is);
 * true when it did. The dead-letter worker and the sweep use it for jobs that died.
 */
export async function failUnfinishedExportFile(
  db: Kysely<Database>,
  id: string,
  message: string,
): Promise<boolean> {
  const result = await db
    .updateTable("export_files")
    .set({ status: "failed", error: message.slice(0, 500), updated_at: sql`now()`, finished_at: sql`now()` })
    .where("id", "=", id)
    .where("status", "in", ["queued", "running"])
    .executeTakeFirst();
  return Number(result.numUpdatedRows) === 1;
}

/** A failed export of this organisation back to queued (its old error and bytes cleared), or undefined. */
export async function requeueFailedExportFile(db: Kysely<Database>, organizationId: string, id: string) {
  return db
    .updateTable("export_files")
    .set({
      status: "queued",
      progress: 0,
      error: null,
      bytes: null,
      byte_size: null,
      finished_at: null,
      updated_at: sql`now()`,
    })
    .where("organization_id", "=", organizationId)
    .where("id", "=", id)
    .where("status", "=", "failed")
    .returning(["id", "design_id", "revision_id", "file_name", "options"])
    .executeTakeFirst();
}

export const STALE_EXPORT_MESSAGE =
  "The sheet was not finished: its queue job ended without a result (the worker preparing it stopped). Use Retry sheet to queue it again.";

/**
 * Queued or running exports of `queue` whose job is no longer waiting, retrying or active in
 * pg-boss (it failed, expired without a retry left, was archived or deleted), and that nobody
 * touched for `graceSeconds` (a row is written just before its job is sent), are marked failed
 * with STALE_EXPORT_MESSAGE. Returns the ids it marked.
 */
export async function sweepStaleExports(
  db: Kysely<Database>,
  queue: string,
  graceSeconds = 120,
): Promise<string[]> {
  const rows = await db
    .updateTable("export_files as e")
    .set({ status: "failed", error: STALE_EXPORT_MESSAGE, updated_at: sql`now()`, finished_at: sql`now()` })
    .where("e.status", "in", ["queued", "running"])
    .where(sql<boolean>`e.updated_at < now() - make_interval(secs => ${graceSeconds})`)
    .where(
      sql<boolean>`not exists (
        select 1 from pgboss.job j
        where j.name = ${queue} and j.data->>'exportFileId' = e.id::text
          and j.state in ('created', 'retry', 'active'))`,
    )
    .returning("e.id")
    .execute();
  return rows.map((row) => row.id);
}

/** The newest background export of `kind` for one revision of this organisation (the Shop files panel). */
export async function findLatestExportJob(
  db: Kysely<Database>,
  organizationId: string,
  revisionId: string,
  kind: string,
): Promise<ExportJobDto | undefined> {
  const row = await db
    .selectFrom("export_files")
    .select("id")
    .where("organization_id", "=", organizationId)
    .where("revision_id", "=", revisionId)
    .where("kind", "=", kind)
    .orderBy("created_at", "desc")
    .limit(1)
    .executeTakeFirst();
  return row ? findExportJob(db, organizationId, row.id) : undefined;
}
