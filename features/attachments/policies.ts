// Who may add and remove attachments. Pure predicates: the route handlers enforce them, the panel
// uses them to hide buttons.
import type { Role } from "@/db/tables/core";

export function canUploadAttachment(viewer: { roles: readonly Role[] }): boolean {
  return viewer.roles.includes("designer") || viewer.roles.includes("admin");
}

/** The uploader or an admin, and only while the design's working revision is not approved. */
export function canDeleteAttachment(
  viewer: { userId: string; roles: readonly Role[] },
  attachment: { uploadedById: string },
  workingRevisionApproved: boolean,
): boolean {
  if (workingRevisionApproved) return false;
  return attachment.uploadedById === viewer.userId || viewer.roles.includes("admin");
}
