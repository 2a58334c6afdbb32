// Who may do what with a design. Pure predicates: the server enforces them in actions and route
// handlers; components call the same functions only to hide buttons.
import type { WorkingRevisionStatus } from "./workspace-contract";

type Role = "designer" | "approver" | "admin";

export interface PolicyViewer {
  userId: string;
  roles: readonly Role[];
}

export interface PolicyDesign {
  ownerId: string;
  /** Status of the working (highest-numbered) revision. */
  status: WorkingRevisionStatus;
}

/** A revision is editable in place only while it is a draft or was returned by the approver. */
export function isEditableStatus(status: WorkingRevisionStatus): boolean {
  return status === "draft" || status === "returned";
}

export function canCreateDesign(viewer: PolicyViewer): boolean {
  return viewer.roles.includes("designer");
}

/** Any designer of the organisation may edit (joint work is common); frozen revisions never. */
export function canEditDesign(viewer: PolicyViewer, design: PolicyDesign): boolean {
  return viewer.roles.includes("designer") && isEditableStatus(design.status);
}

/** Duplicating creates a new design, so it needs exactly what creating needs. */
export function canDuplicateDesign(viewer: PolicyViewer): boolean {
  return canCreateDesign(viewer);
}

export function canArchiveDesign(viewer: PolicyViewer, design: Pick<PolicyDesign, "ownerId">): boolean {
  return viewer.userId === design.ownerId || viewer.roles.includes("admin");
}

/**
 * Deleting throws work away, so only the owner or an admin may, and only a design whose single
 * revision is a draft that was never submitted (anything reviewed stays on record).
 */
export function canDeleteDesign(
  viewer: PolicyViewer,
  design: Pick<PolicyDesign, "ownerId" | "status"> & { revisionCount: number; everSubmitted: boolean },
): boolean {
  return (
    canArchiveDesign(viewer, design) &&
    design.revisionCount === 1 &&
    design.status === "draft" &&
    !design.everSubmitted
  );
}
