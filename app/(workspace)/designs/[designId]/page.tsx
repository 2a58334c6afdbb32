import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { getDb } from "@/db/index";
import { saveWorkingRevisionAction, setUnitSystemAction } from "@/features/designs/actions";
import { findDesign } from "@/features/designs/queries";
import { toWorkspaceDesign } from "@/features/designs/workspace-dto";
import { DesignWorkspace } from "@/features/editor/components/design-workspace";
import { requireViewer } from "@/server/auth/guard";

export const metadata: Metadata = { title: "Joint design" };

// The working revision in the editor. Another organisation's id is a 404 like an unknown one.
export default async function DesignPage({ params }: { params: Promise<{ designId: string }> }) {
  const viewer = await requireViewer();
  const design = await findDesign(getDb(), viewer.organizationId, (await params).designId);
  if (!design) notFound();
  return (
    <DesignWorkspace
      design={toWorkspaceDesign(design, viewer)}
      saveAction={saveWorkingRevisionAction}
      unitSystem={viewer.unitSystem}
      setUnitSystemAction={setUnitSystemAction}
    />
  );
}
