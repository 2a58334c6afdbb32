import {
  decideTransition,
  isEditableStatus,
  type ReviewActor,
  type RevisionFacts,
} from "./model/review-states";

// Who may do what on a revision. The server enforces these inside the transaction that locks the
// revision (queries.ts); components call the same predicates only to hide buttons.
export type { ReviewActor, RevisionFacts } from "./model/review-states";

export const canSubmitRevision = (actor: ReviewActor, revision: RevisionFacts): boolean =>
  decideTransition("submit", actor, revision).allowed;

export const canApproveRevision = (actor: ReviewActor, revision: RevisionFacts): boolean =>
  decideTransition("approve", actor, revision).allowed;

export const canReturnRevision = (actor: ReviewActor, revision: RevisionFacts): boolean =>
  decideTransition("return", actor, revision).allowed;

export const canStartNewRevision = (actor: ReviewActor, revision: RevisionFacts): boolean =>
  decideTransition("start-new-revision", actor, revision).allowed;

/** Any member of the organisation may comment, at any state (a comment never changes the revision). */
export const canCommentOnRevision = (actor: ReviewActor): boolean => actor.roles.length > 0;

/** Whether the design's save path may write this revision (designers, Draft or Returned only). */
export const canEditRevision = (
  actor: ReviewActor,
  revision: Pick<RevisionFacts, "status" | "isWorking">,
): boolean => actor.roles.includes("designer") && revision.isWorking && isEditableStatus(revision.status);
