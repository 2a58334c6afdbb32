// The kinds of entry in a design's activity log and how they read on screen (neutral module).
export type ActivityKind =
  "created" | "saved" | "submitted" | "returned" | "approved" | "new-revision" | "commented" | "exported";

export const ACTIVITY_LABELS: Record<ActivityKind, string> = {
  created: "created the design",
  saved: "saved",
  submitted: "submitted for review",
  returned: "returned",
  approved: "approved",
  "new-revision": "started a new revision",
  commented: "commented",
  exported: "exported",
};

export interface ActivityEntryDto {
  id: string;
  kind: ActivityKind;
  actorName: string;
  /** Revision number the entry is about, when it is about one. */
  revisionNumber: number | null;
  detail: string;
  /** ISO 8601 */
  at: string;
}
