import type { ColumnType, Generated, JSONColumnType } from "kysely";

// Tables of review and approval (migrations/2026_12_01_000600_create_reviews.ts). All four are
// append-only: the database refuses UPDATE and direct DELETE, so there are no Updateable types.
// Not Generated<…>: Kysely 0.28 does not unwrap a ColumnType inside Generated.
type CreatedAt = ColumnType<Date, Date | string | undefined, never>;

/**
 * A value a stored result depends on whose source is tagged as remembered, as listed by
 * features/analysis/unverified-values.ts and stored with an approval.
 */
export interface UnverifiedValue {
  /** Stable key ("catalogue:nuts:iso-4032-M24", "check:flange.rating"): never shown. */
  key: string;
  /** What the value is, in words. */
  what: string;
  /** The value with its unit (SI, as stored). */
  value: string;
  /** Where it came from: table or clause, and its edition note. */
  source: string;
}

export type CommentTargetKind = "bolt" | "check";
export type DecisionKind = "approved" | "returned";
export type ActivityKind =
  "created" | "saved" | "submitted" | "returned" | "approved" | "new-revision" | "commented" | "exported";

export interface RevisionCommentsTable {
  id: Generated<string>;
  revision_id: string;
  organization_id: string;
  author_id: string;
  body: string;
  target_kind: CommentTargetKind | null;
  /** A bolt id of the revision's document ("b3") or a check id of its result. */
  target_id: string | null;
  created_at: CreatedAt;
}

export interface RevisionDecisionsTable {
  id: Generated<string>;
  revision_id: string;
  organization_id: string;
  kind: DecisionKind;
  actor_id: string;
  /** Required (non-blank) for a return; optional note for an approval. */
  comment: Generated<string>;
  /** The snapshot hash the decision was made on. */
  content_hash: string;
  /**
   * The unverified values (features/analysis/unverified-values.ts) the approver acknowledged, as a
   * JSON array (migrations/2026_12_03_071500_decision_unverified_values.ts, which checks it is one); [] for a return.
   */
  acknowledged_unverified: JSONColumnType<UnverifiedValue[], string | undefined, never>;
  /** The FE cross-check run the approval saw (migrations/2026_12_03_093000_create_fe_checks.ts), and its result's hash. */
  fe_check_id: ColumnType<string | null, string | null | undefined, never>;
  fe_result_hash: ColumnType<string | null, string | null | undefined, never>;
  created_at: CreatedAt;
}

export interface RevisionJustificationsTable {
  id: Generated<string>;
  revision_id: string;
  organization_id: string;
  check_id: string;
  /** The status the check had when it was justified. */
  check_status: "warn" | "fail";
  text: string;
  author_id: string;
  created_at: CreatedAt;
}

export interface DesignActivityTable {
  id: Generated<string>;
  organization_id: string;
  design_id: string;
  revision_id: string | null;
  actor_id: string;
  kind: ActivityKind;
  detail: Generated<string>;
  created_at: CreatedAt;
}

/**
 * Everyone who created, saved or submitted a revision, one row per person
 * (migrations/2026_12_02_131700_revision_editors.ts). Written by a trigger on design_revisions;
 * append-only. The four-eyes rule refuses a decision by anyone listed here.
 */
export interface RevisionEditorsTable {
  revision_id: string;
  user_id: string;
  first_at: CreatedAt;
}

export interface ReviewTables {
  revision_editors: RevisionEditorsTable;
  revision_comments: RevisionCommentsTable;
  revision_decisions: RevisionDecisionsTable;
  revision_justifications: RevisionJustificationsTable;
  design_activity: DesignActivityTable;
}
