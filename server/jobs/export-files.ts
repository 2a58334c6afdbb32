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
