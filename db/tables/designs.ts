import type { Generated, JSONColumnType } from "kysely";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import type { Timestamp } from "./columns";

export type RevisionStatus = "draft" | "in_review" | "returned" | "approved";

export interface DesignsTable {
  id: Generated<string>;
  organization_id: string;
  name: string;
  equipment_tag: Generated<string>;
  /** Copied from the working revision's outline kind for listing and filtering. */
  outline_kind: string;
  owner_id: string;
  created_at: Timestamp;
  updated_at: Timestamp;
  archived_at: Timestamp | null;
}

export interface DesignRevisionsTable {
  id: Generated<string>;
  design_id: string;
  organization_id: string;
  number: number;
  status: Generated<RevisionStatus>;
  /** The JointDesign document (features/analysis/core/design.ts), validated before it is written (JSON text). */
  document: JSONColumnType<JointDesign>;
  /**
   * The JointAnalysis computed by the core from `document` (authoritative, stored on save) by
   * `core_version`; a result of an older core is read as stored (its readers check what they use).
   */
  result: JSONColumnType<JointAnalysis | null, string | null | undefined, string | null>;
  core_version: string | null;
  content_hash: string | null;
  /** Optimistic-lock counter: every save sends the version it was based on. */
  version: Generated<number>;
  created_by: string;
  last_edited_by: string;
  submitted_by: string | null;
  submitted_at: Timestamp | null;
  decided_by: string | null;
  decided_at: Timestamp | null;
  created_at: Timestamp;
  updated_at: Timestamp;
}

export interface DesignTables {
  designs: DesignsTable;
  design_revisions: DesignRevisionsTable;
}
