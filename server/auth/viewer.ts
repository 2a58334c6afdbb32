import "server-only";
import type { Role, UnitSystem } from "@/db/tables/core";
import { getLucia } from "./lucia";
import { noteViewer } from "@/server/log/request-context";

// Who is signed in, in which organisation, with which roles. The Viewer is a DTO safe to hand to
// client components: no session id, no password hash.
export interface Viewer {
  userId: string;
  email: string;
  displayName: string;
  unitSystem: UnitSystem;
  organizationId: string;
  organizationName: string;
  organizationSlug: string;
  roles: Role[];
}

export interface ViewerContext {
  viewer: Viewer;
  sessionId: string;
}

const ROLE_ORDER: Role[] = ["designer", "approver", "admin"];

export function sortRoles(roles: readonly Role[]): Role[] {
  return ROLE_ORDER.filter((role) => roles.includes(role));
}

/**
 * Validates a session id (sliding its expiry) and resolves the active organisation: the one on
 * the session if the user still belongs to it, else their oldest membership. A user without any
 * membership has no viewer (they cannot see any data).
 */
export async function resolveViewerContext(
  sessionId: string | null | undefined,
): Promise<ViewerContext | null> {
  if (!sessionId) return null;
  // One query: lucia's session lookup also brings the user's memberships (adapter.ts).
  const { session, user } = await getLucia().validateSession(sessionId);
  if (!session || !user) return null;
  const memberships = user.memberships;
  const active = memberships.find((m) => m.id === session.activeOrganizationId) ?? memberships[0];
  if (!active) return null;
  noteViewer(user.id, active.id);
  return {
    sessionId: session.id,
    viewer: {
      userId: user.id,
      email: user.email,
      displayName: user.displayName,
      unitSystem: user.unitSystem,
      organizationId: active.id,
      organizationName: active.name,
      organizationSlug: active.slug,
      roles: sortRoles(active.roles),
    },
  };
}

/** `role` as an array means "any of these"; no option means any member. */
export function hasRole(viewer: Viewer, role?: Role | Role[]): boolean {
  if (!role) return true;
  const wanted = Array.isArray(role) ? role : [role];
  return wanted.some((r) => viewer.roles.includes(r));
}
