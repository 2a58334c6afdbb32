import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { z } from "zod";
import { getDb } from "@/db/index";
import { ActivityList } from "@/features/activity/components/activity-list";
import { listActivity } from "@/features/activity/queries";
import {
  addCommentAction,
  approveRevisionAction,
  returnRevisionAction,
  startNewRevisionAction,
  submitRevisionAction,
} from "@/features/reviews/actions";
import { RevisionHeader } from "@/features/reviews/components/revision-header";
import { independenceNote } from "@/features/reviews/independence-note";
import { getRevisionReview } from "@/features/reviews/queries";
import { CautionPanel } from "@/features/ui/caution-panel";
import { FlangeSummary } from "@/features/analysis/components/flange-summary";
import { FeCheckPanel } from "@/features/fe-check/components/fe-check-panel";
import { canRunFeCheck } from "@/features/fe-check/policies";
import { requireViewer } from "@/server/auth/guard";
import { ReviewScreen } from "./_components/review-screen";

export const metadata: Metadata = { title: "Sign-off sheet" };

const paramsSchema = z.object({ designId: z.uuid(), number: z.coerce.number().int().min(1).max(100_000) });

export default async function RevisionReviewPage({
  params,
}: {
  params: Promise<{ designId: string; number: string }>;
}) {
  const viewer = await requireViewer();
  const parsed = paramsSchema.safeParse(await params);
  if (!parsed.success) notFound();
  const db = getDb();
  const review = await getRevisionReview(db, viewer, parsed.data.designId, parsed.data.number);
  if (!review) notFound();
  const activity = await listActivity(db, viewer.organizationId, review.designId, { limit: 40 });
  return (
    <div className="flex flex-col gap-6">
      <RevisionHeader review={review} />
      <ReviewScreen
        review={review}
        unitSystem={viewer.unitSystem}
        independenceNote={independenceNote(review, viewer)}
        addCommentAction={addCommentAction}
        actions={{
          submitRevisionAction,
          approveRevisionAction,
          returnRevisionAction,
          startNewRevisionAction,
        }}
      />
      {review.result ? (
        <section aria-labelledby="flange-heading" className="rounded-plate bg-white p-panel shadow-plate">
          <h2 id="flange-heading" className="text-lead font-semibold text-ink-900">
            Flange
          </h2>
          <FlangeSummary analysis={review.result} units={viewer.unitSystem} />
        </section>
      ) : null}
      <FeCheckPanel
        designId={review.designId}
        revisionNumber={parsed.data.number}
        units={viewer.unitSystem}
        canRun={canRunFeCheck(viewer)}
        frozen={review.status === "approved"}
      />
      <CautionPanel />
      <ActivityList entries={activity} title="Design activity" />
    </div>
  );
}
