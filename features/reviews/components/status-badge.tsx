import { STATUS_LABELS, type ReviewStatus } from "../model/review-states";

const STYLE: Record<ReviewStatus, string> = {
  draft: "bg-ink-100 text-ink-700",
  in_review: "bg-brass-100 text-brass-700",
  returned: "bg-verdict-warn-bg text-verdict-warn",
  approved: "bg-verdict-pass-bg text-verdict-pass",
};

export function StatusBadge({ status }: { status: ReviewStatus }) {
  return (
    <span
      data-testid="revision-status"
      className={`inline-block rounded-plate px-2 py-0.5 text-table font-semibold ${STYLE[status]}`}
    >
      {STATUS_LABELS[status]}
    </span>
  );
}
