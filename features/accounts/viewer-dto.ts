import type { Viewer } from "@/server/auth/viewer";

// What GET /api/v1/me returns: the Viewer exactly as the screens use it, copied field by field
// so that a field added to the session lookup later is never leaked by accident.
export type ViewerDto = Viewer;

export function toViewerDto(viewer: Viewer): ViewerDto {
  return {
    userId: viewer.userId,
    email: viewer.email,
    displayName: viewer.displayName,
    unitSystem: viewer.unitSystem,
    organizationId: viewer.organizationId,
    organizationName: viewer.organizationName,
    organizationSlug: viewer.organizationSlug,
    roles: [...viewer.roles],
  };
}
