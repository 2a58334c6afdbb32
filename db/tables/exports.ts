import type { Generated, JSONColumnType } from "kysely";
import type { Timestamp } from "./columns";

// Tables of migrations/2026_12_01_000800_create_export_files.ts.

export type ExportFileStatus = "queued" | "running" | "done" | "failed";

/** What a queued spacing sheet is rendered with (`export_files.options`). */
export interface SheetJobOptions {
  revisionNumber: number;
  paper: "a4" | "letter";
  units: "SI" | "US";
}

export interface ExportFilesTable {
  /** Also the pg-boss job id and the id in /api/v1/jobs/[jobId]. */
  id: Generated<string>;
  organization_id: string;
  design_id: string;
  revision_id: string;
  /** "spacing-sheet" (the only background export so far). */
  kind: string;
  /** Render options (JSON text on insert). */
  options: JSONColumnType<SheetJobOptions, string | undefined, string>;
  status: Generated<ExportFileStatus>;
  /** 0…100. */
  progress: Generated<number>;
  file_name: string;
  content_type: string;
  bytes: Buffer | null;
  byte_size: number | null;
  error: string | null;
  requested_by: string | null;
  created_at: Timestamp;
  updated_at: Timestamp;
  finished_at: Timestamp | null;
}

export interface ExportTables {
  export_files: ExportFilesTable;
}
