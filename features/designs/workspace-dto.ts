import { canEditDesign, type PolicyViewer } from "./policies";
import type { DesignDetailDto } from "./queries";
import type { WorkspaceDesignDto } from "./workspace-contract";

/** What the editor receives: the working revision and whether this viewer may edit it. */
export function toWorkspaceDesign(design: DesignDetailDto, viewer: PolicyViewer): WorkspaceDesignDto {
  return {
    designId: design.designId,
    name: design.name,
    equipmentTag: design.equipmentTag,
    revisionNumber: design.revisionNumber,
    status: design.status,
    version: design.version,
    document: design.document,
    result: design.result,
    canEdit: canEditDesign(viewer, design),
    ownerName: design.ownerName,
    updatedAt: design.revisionUpdatedAt,
  };
}
