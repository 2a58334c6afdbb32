// DTOs of the review feature (types only: safe to import from client components).
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import type { SnapshotIntegrity } from "@/features/analysis/content-hash";
import type { UnverifiedValue } from "@/features/analysis/unverified-values";
import type { ReviewStatus } from "./model/review-states";
import type { ReviewCheck } from "./model/review-checks";
import type { BoltMove, CheckChange, FieldChange, KeyResults } from "./model/compare-revisions";

export interface CommentDto {
  id: string;
  authorName: string;
  body: string;
  targetKind: "bolt" | "check" | null;
  targetId: string | null;
  /** ISO 8601 */
  at: string;
}

export interface JustificationDto {
  checkId: string;
  checkStatus: "warn" | "fail";
  text: string;
  authorName: string;
  at: string;
}

export interface DecisionDto {
  kind: "approved" | "returned";
  actorName: string;
  comment: string;
  /** The unverified values the approver acknowledged (empty for a return and for older approvals). */
  acknowledgedUnverified: UnverifiedValue[];
  at: string;
}

export interface RevisionPermissions {
  canSubmit: boolean;
  canApprove: boolean;
  canReturn: boolean;
  canStartNew: boolean;
  canComment: boolean;
  canEdit: boolean;
}

export interface RevisionReviewDto {
  designId: string;
  designName: string;
  equipmentTag: string;
  revisionId: string;
  number: number;
  status: ReviewStatus;
  version: number;
  document: JointDesign;
  /** The JointAnalysis (frozen for In review / Approved; the last save's result otherwise). */
  result: JointAnalysis | null;
  coreVersion: string | null;
  integrity: SnapshotIntegrity;
  checks: ReviewCheck[];
  /** Table values from memory the stored result depends on (features/analysis/unverified-values.ts). */
  unverifiedValues: UnverifiedValue[];
  createdByName: string;
  lastEditedByName: string;
  submittedByName: string | null;
  submittedAt: string | null;
  decidedByName: string | null;
  decidedAt: string | null;
  isWorking: boolean;
  /** Every revision number of the design, ascending (for the comparison picker). */
  revisionNumbers: number[];
  comments: CommentDto[];
  justifications: JustificationDto[];
  decisions: DecisionDto[];
  permissions: RevisionPermissions;
}

export interface RevisionSummaryDto {
  number: number;
  status: ReviewStatus;
  contentHash: string | null;
  submittedAt: string | null;
  decidedAt: string | null;
  updatedAt: string;
}

export interface DeskItemDto {
  designId: string;
  designName: string;
  equipmentTag: string;
  number: number;
  /** Who submitted (waiting list) or who returned it (returned list). */
  personName: string;
  at: string;
  href: string;
  /** The return comment (returned list only). */
  comment: string;
}

export interface DeskListsDto {
  isApprover: boolean;
  waitingForMyReview: DeskItemDto[];
  returnedToMe: DeskItemDto[];
}

export interface RevisionComparisonDto {
  designId: string;
  designName: string;
  from: { number: number; status: ReviewStatus; document: JointDesign; keyResults: KeyResults };
  to: { number: number; status: ReviewStatus; document: JointDesign; keyResults: KeyResults };
  fieldChanges: FieldChange[];
  boltMoves: BoltMove[];
  checkChanges: CheckChange[];
  revisionNumbers: number[];
}
