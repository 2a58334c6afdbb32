// The review state machine as pure functions: no database, no framework. The server actions run
// these inside the transaction that holds the revision's row lock, so the decision is made on the
// state the database will actually change, and the policies in ../policies.ts use the same rules
// to hide buttons.
export type ReviewStatus = "draft" | "in_review" | "returned" | "approved";
export type ReviewRole = "designer" | "approver" | "admin";
export type ReviewCommand = "submit" | "approve" | "return" | "start-new-revision";

/** Plain words shown on every screen (glossary: DEVELOPERS.md). */
export const STATUS_LABELS: Record<ReviewStatus, string> = {
  draft: "Draft",
  in_review: "In review",
  returned: "Returned",
  approved: "Approved",
};

export interface ReviewActor {
  userId: string;
  roles: readonly ReviewRole[];
}

/** The parts of a revision the rules look at. */
export interface RevisionFacts {
  status: ReviewStatus;
  createdBy: string;
  lastEditedBy: string;
  submittedBy: string | null;
  /** Everyone who created, saved or submitted this revision (table revision_editors). */
  editorIds: readonly string[];
  /** Whether this is the design's highest-numbered revision. */
  isWorking: boolean;
}

export type TransitionVerdict = { allowed: true; to: ReviewStatus } | { allowed: false; reason: string };

const refuse = (reason: string): TransitionVerdict => ({ allowed: false, reason });

/** Editable states: a returned revision is fixed in place like a draft, then resubmitted. */
export function isEditableStatus(status: ReviewStatus): boolean {
  return status === "draft" || status === "returned";
}

/** Frozen states carry a snapshot (document, result, core version, content hash). */
export function isFrozenStatus(status: ReviewStatus): boolean {
  return status === "in_review" || status === "approved";
}

/**
 * Four-eyes rule: whoever created, saved (at any time, not only last) or submitted the revision is
 * not independent of it, so cannot decide on it (approve or return). The database refuses the same.
 */
export function isIndependentOf(actor: ReviewActor, revision: RevisionFacts): boolean {
  return ![revision.createdBy, revision.lastEditedBy, revision.submittedBy, ...revision.editorIds].includes(
    actor.userId,
  );
}

export function decideTransition(
  command: ReviewCommand,
  actor: ReviewActor,
  revision: RevisionFacts,
): TransitionVerdict {
  const label = STATUS_LABELS[revision.status];
  switch (command) {
    case "submit":
      if (!actor.roles.includes("designer"))
        return refuse("Only a designer can submit a revision for review.");
      if (!revision.isWorking) return refuse("Only the working revision can be submitted.");
      if (!isEditableStatus(revision.status))
        return refuse(`This revision is ${label}; only a Draft or Returned revision can be submitted.`);
      return { allowed: true, to: "in_review" };
    case "approve":
    case "return": {
      const verb = command === "approve" ? "approve" : "return";
      if (!actor.roles.includes("approver")) return refuse(`Only an approver can ${verb} a revision.`);
      if (revision.status !== "in_review")
        return refuse(
          `This revision is ${label}; only a revision In review can be ${verb === "approve" ? "approved" : "returned"}.`,
        );
      if (!isIndependentOf(actor, revision)) {
        return refuse(
          `You created, saved or submitted this revision, so you cannot ${verb} it: another approver must decide (four-eyes rule).`,
        );
      }
      return { allowed: true, to: command === "approve" ? "approved" : "returned" };
    }
    case "start-new-revision":
      if (!actor.roles.includes("designer")) return refuse("Only a designer can start a new revision.");
      if (revision.status !== "approved")
        return refuse(`This revision is ${label}; a new revision starts from an Approved one.`);
      if (!revision.isWorking) return refuse("A newer revision of this design already exists.");
      return { allowed: true, to: "draft" };
  }
}
