import type { RevisionReviewDto } from "./review-dto";

/** Why an approver sees no sign-off buttons on a revision In review (shown instead of the forms). */
export function independenceNote(
  review: RevisionReviewDto,
  viewer: { roles: readonly string[] },
): string | null {
  if (review.status === "in_review" && viewer.roles.includes("approver") && !review.permissions.canApprove) {
    return "You created, saved or submitted this revision, so another approver has to decide on it (four-eyes rule).";
  }
  if (review.status === "in_review" && !viewer.roles.includes("approver")) return "Waiting for an approver.";
  if (review.status === "approved")
    return "Approved revisions are frozen; start a new revision to change the design.";
  return null;
}
