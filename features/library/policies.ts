// Who may change the Stockroom: admins edit, every member reads. Pure, so components can hide
// buttons with the same rule the actions and route handlers enforce.
import type { Role } from "@/db/tables/core";

export function canEditLibrary(viewer: { roles: readonly Role[] }): boolean {
  return viewer.roles.includes("admin");
}
