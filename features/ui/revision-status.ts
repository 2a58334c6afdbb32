import type { RevisionStatus } from "@/db/tables/designs";

export type { RevisionStatus };

/** The four states of a revision in the words every screen and sheet shows (glossary: DEVELOPERS.md). */
export const REVISION_STATUS_LABELS: Record<RevisionStatus, string> = {
  draft: "Draft",
  in_review: "In review",
  returned: "Returned",
  approved: "Approved",
};
