import Link from "next/link";
import { ActivityList } from "@/features/activity/components/activity-list";
import type { ActivityEntryDto } from "@/features/activity/activity-kinds";
import { canUploadAttachment } from "@/features/attachments/policies";
import type { WorkspaceDesignDto } from "@/features/designs/workspace-contract";
import { ExportButtons } from "@/features/exports/components/export-buttons";
import { canRunFeCheck } from "@/features/fe-check/policies";
import { buttonStyles } from "@/features/ui/button-styles";
import { Panel } from "@/features/ui/panel";
import { REVISION_STATUS_LABELS } from "@/features/ui/revision-status";
import type { Viewer } from "@/server/auth/guard";
import type { ExportJobDto } from "@/server/jobs/export-files";
import { retrySheetAction } from "@/features/exports/actions";
import { LazyAttachmentPanel, LazyFeCheckPanel } from "./lazy-companions";

// Where the editor meets the other features on the design page: the sign-off sheet (submit and
// review), the shop files, the FE cross-check, the attachments and the activity log of the design.
export function DesignCompanions({
  design,
  viewer,
  activity,
  latestSheetJob,
}: {
  design: WorkspaceDesignDto;
  viewer: Viewer;
  activity: ActivityEntryDto[];
  latestSheetJob: ExportJobDto | null;
}) {
  const signOffHref = `/designs/${design.designId}/revisions/${design.revisionNumber}`;
  return (
    <div className="mt-6 grid gap-6 lg:grid-cols-2">
      <Panel id="sign-off-heading" title="Sign-off" className="p-4">
        <p className="mt-1 text-table text-ink-700">
          Revision {design.revisionNumber} is <strong>{REVISION_STATUS_LABELS[design.status]}</strong>. Save
          your edits, then open the sign-off sheet to submit it for review, read the comments or start a new
          revision.
        </p>
        <Link href={signOffHref} className={`${buttonStyles.secondary} mt-3`}>
          Open the sign-off sheet
        </Link>
      </Panel>
      <Panel id="shop-files-heading" title="Shop files" className="p-4">
        <p className="mt-1 text-table text-ink-700">
          From the last saved result of revision {design.revisionNumber}.
        </p>
        <div className="mt-3">
          <ExportButtons
            designId={design.designId}
            revisionNumber={design.revisionNumber}
            boltCount={design.document.bolts.length}
            unitSystem={viewer.unitSystem}
            hasResult={design.result !== null}
            latestSheetJob={latestSheetJob}
            retrySheetAction={retrySheetAction}
          />
        </div>
      </Panel>
      <div className="lg:col-span-2">
        <LazyFeCheckPanel
          designId={design.designId}
          revisionNumber={design.revisionNumber}
          units={viewer.unitSystem}
          canRun={canRunFeCheck(viewer)}
          frozen={design.status === "approved"}
        />
      </div>
      <LazyAttachmentPanel
        designId={design.designId}
        canUpload={canUploadAttachment(viewer)}
        canDeleteAny={viewer.roles.includes("admin") && design.status !== "approved"}
        viewerId={viewer.userId}
      />
      <ActivityList entries={activity} title="Design activity" />
    </div>
  );
}
