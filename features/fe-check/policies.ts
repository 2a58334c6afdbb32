// Who may run and cancel FE cross-checks: designers and approvers. Everyone in the organisation reads them.
export function canRunFeCheck(viewer: { roles: readonly string[] }): boolean {
  return viewer.roles.includes("designer") || viewer.roles.includes("approver");
}
