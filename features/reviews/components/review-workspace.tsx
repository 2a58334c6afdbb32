"use client";

import { useState, type ReactNode } from "react";
import type { UnitSystem } from "@/features/analysis/core/design";
import { groupByRule } from "@/features/analysis/rule-groups";
import type { CommentDto, RevisionReviewDto } from "../review-dto";
import { CommentThread, type AddCommentAction } from "./comment-thread";
import { DecisionPanel, type DecisionActions } from "./decision-panel";
import { ReviewCheckList, type CheckPick } from "./review-check-list";

export interface ReviewHighlight {
  boltIds?: string[];
  checkId?: string;
}

/**
 * The interactive part of the review screen: the drawing (a slot, so the editor's read-only view
 * is composed in app/), checks, the comment thread and the sign-off forms, sharing one highlight.
 */
export function ReviewWorkspace(props: {
  review: RevisionReviewDto;
  unitSystem: UnitSystem;
  independenceNote: string | null;
  renderDrawing: (highlight: ReviewHighlight | undefined) => ReactNode;
  addCommentAction: AddCommentAction;
  actions: DecisionActions;
}) {
  const { review } = props;
  const [highlight, setHighlight] = useState<{
    source: string;
    value: ReviewHighlight;
    label: string;
  } | null>(null);

  const pickCheck = (pick: CheckPick | null) =>
    setHighlight(
      pick
        ? {
            source: `check:${pick.id}`,
            value: { checkId: pick.id, boltIds: pick.boltIds },
            label: `check ${pick.title}`,
          }
        : null,
    );
  const pickComment = (comment: CommentDto | null) => {
    if (!comment || !comment.targetId) return setHighlight(null);
    if (comment.targetKind === "bolt")
      return setHighlight({
        source: `comment:${comment.id}`,
        value: { boltIds: [comment.targetId] },
        label: `bolt ${comment.targetId}`,
      });
    const check = review.checks.find((c) => c.id === comment.targetId);
    const rule = groupByRule(review.checks).find((r) => r.rule === comment.targetId);
    setHighlight({
      source: `comment:${comment.id}`,
      value: { checkId: comment.targetId, boltIds: check?.boltIds ?? rule?.boltIds ?? [] },
      label: `check ${check?.title ?? rule?.title ?? "no longer in the result"}`,
    });
  };
  const activeCommentId = highlight?.source.startsWith("comment:")
    ? highlight.source.slice("comment:".length)
    : null;

  return (
    <div className="flex min-w-0 flex-col gap-gutter">
      <div
        className="min-w-0 overflow-x-auto rounded-plate bg-white p-2 shadow-plate"
        data-testid="review-drawing"
        data-highlight-bolts={(highlight?.value.boltIds ?? []).join(" ")}
        data-highlight-check={highlight?.value.checkId ?? ""}
      >
        {props.renderDrawing(highlight?.value)}
        <p
          role="status"
          aria-live="polite"
          className="min-h-5 px-1 text-table text-brass-700"
          data-testid="highlight-status"
        >
          {highlight ? `Highlighted on the drawing: ${highlight.label}` : ""}
        </p>
      </div>
      <div className="grid gap-gutter lg:grid-cols-[minmax(0,1fr)_24rem]">
        <section
          aria-labelledby="checks-heading"
          className="min-w-0 overflow-x-auto rounded-plate bg-white p-panel shadow-plate"
        >
          <h2 id="checks-heading" className="text-lead font-semibold text-ink-900">
            Checks and justifications
          </h2>
          <ReviewCheckList
            checks={review.checks}
            justifications={review.justifications}
            unitSystem={props.unitSystem}
            activeCheckId={highlight?.value.checkId ?? null}
            onPick={pickCheck}
          />
        </section>
        <div className="flex flex-col gap-4">
          <DecisionPanel
            designId={review.designId}
            number={review.number}
            version={review.version}
            status={review.status}
            checks={review.checks}
            unverifiedValues={review.unverifiedValues}
            permissions={review.permissions}
            independenceNote={props.independenceNote}
            actions={props.actions}
          />
          <div className="rounded-plate bg-white p-panel shadow-plate">
            <CommentThread
              designId={review.designId}
              number={review.number}
              comments={review.comments}
              boltIds={review.document.bolts.map((b) => b.id)}
              checks={review.checks}
              canComment={review.permissions.canComment}
              activeCommentId={activeCommentId}
              onPickComment={pickComment}
              addCommentAction={props.addCommentAction}
            />
          </div>
        </div>
      </div>
    </div>
  );
}
