"use client";

import type { UnitSystem } from "@/features/analysis/core/design";
import { ReadOnlyJointView } from "@/features/editor/components/read-only-joint-view";
import type { AddCommentAction } from "@/features/reviews/components/comment-thread";
import type { DecisionActions } from "@/features/reviews/components/decision-panel";
import { ReviewWorkspace } from "@/features/reviews/components/review-workspace";
import type { RevisionReviewDto } from "@/features/reviews/review-dto";

// Where the review feature meets the editor's read-only drawing (reviews may not import the editor: DEVELOPERS.md, "Dependency rule").
export function ReviewScreen(props: {
  review: RevisionReviewDto;
  unitSystem: UnitSystem;
  independenceNote: string | null;
  addCommentAction: AddCommentAction;
  actions: DecisionActions;
}) {
  const { review } = props;
  return (
    <ReviewWorkspace
      {...props}
      renderDrawing={(highlight) => (
        <ReadOnlyJointView
          document={review.document}
          result={review.result}
          unitSystem={props.unitSystem}
          highlight={highlight}
        />
      )}
    />
  );
}
