import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { getDb } from "@/db/index";
import { listActivity } from "@/features/activity/queries";
import { saveWorkingRevisionAction, setUnitSystemAction } from "@/features/designs/actions";
import { findDesign } from "@/features/designs/queries";
import { toWorkspaceDesign } from "@/features/designs/workspace-dto";
import { DesignWorkspace } from "@/features/editor/components/design-workspace";
import { buildEditorChoices } from "@/features/editor/model/editor-choices";
import { requireViewer } from "@/server/auth/guard";
import { findLatestExportJob } from "@/server/jobs/export-files";
import { DesignCompanions } from "./_components/design-companions";

export const metadata: Metadata = { title: "Joint design" };

// The working revision in the editor. Another organisation's id is a 404 like an unknown one.
export default async function DesignPage({ params }: { params: Promise<{ designId: string }> }) {
  const viewer = await requireViewer();
  const db = getDb();
  const design = await findDesign(db, viewer.organizationId, (await params).designId);
  if (!design) notFound();
  const workspace = toWorkspaceDesign(design, viewer);
  const activity = await listActivity(db, viewer.organizationId, workspace.designId, { limit: 30 });
  // The revision's last background sheet, so a sheet still rendering or one that failed (also
  // while nobody watched) shows in the Shop files panel after a reload.
  const latestSheet = await findLatestExportJob(
    db,
    viewer.organizationId,
    design.revisionId,
    "spacing-sheet",
  );
  return (
    <>
      <DesignWorkspace
        design={workspace}
        saveAction={saveWorkingRevisionAction}
        unitSystem={viewer.unitSystem}
        setUnitSystemAction={setUnitSystemAction}
        choices={buildEditorChoices()}
      />
      <DesignCompanions
        design={workspace}
        viewer={viewer}
        activity={activity}
        latestSheetJob={latestSheet ?? null}
      />
    </>
  );
}
