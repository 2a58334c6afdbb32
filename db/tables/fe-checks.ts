import type { ColumnType, Generated } from "kysely";
import type { Timestamp } from "./columns";

// Tables of migrations/2026_12_03_093000_create_fe_checks.ts.

export type FeCheckStatus = "queued" | "running" | "done" | "failed" | "cancelled";

export interface FeChecksTable {
  /** Also the pg-boss job id. */
  id: Generated<string>;
  organization_id: string;
  design_id: string;
  revision_id: string;
  /** sha-256 of the canonical JSON of the document the run solved. */
  document_hash: string;
  status: Generated<FeCheckStatus>;
  /** What the run is doing, in words ("Bolt stack: linear run 3"). */
  stage: Generated<string>;
  /** features/fe-check/fe-check-result.ts FeProgress, as JSON. */
  progress: ColumnType<unknown, string | undefined, string>;
  /** features/fe-check/fe-check-result.ts FeCheckResult, as JSON; set with status done. */
  result: ColumnType<unknown, string | null | undefined, string | null>;
  result_hash: string | null;
  error: string | null;
  attempts: Generated<number>;
  cancel_requested: Generated<boolean>;
  requested_by: string | null;
  created_at: Timestamp;
  updated_at: Timestamp;
  started_at: Timestamp | null;
  finished_at: Timestamp | null;
}

export interface FeCheckTables {
  fe_checks: FeChecksTable;
}
