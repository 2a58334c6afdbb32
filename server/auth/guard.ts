import "server-only";
import { cookies, headers } from "next/headers";
import { forbidden, redirect } from "next/navigation";
import { cache } from "react";
import { DATABASE_RETRY_AFTER_SECONDS, isDatabaseUnavailable } from "@/db/connection-errors";
import type { Role } from "@/db/tables/core";
import { getEnv } from "@/server/env";
import { getLucia, SESSION_COOKIE_NAME } from "./lucia";
import { hasRole, resolveViewerContext, type Viewer, type ViewerContext } from "./viewer";
import { cacheControl } from "@/server/http/cache-control";

// The one authorisation helper of pages, server actions and route handlers (DEVELOPERS.md, "How a
// change flows"). Data of another organisation is a 404 at the query, a missing role a 403 here.
export type { Role } from "@/db/tables/core";
export type { Viewer } from "./viewer";

/** The viewer and session of this request (pages, layouts, actions); cached per request. */
export const getViewerContext = cache(async (): Promise<ViewerContext | null> => {
  const store = await cookies();
  return resolveViewerContext(store.get(SESSION_COOKIE_NAME)?.value);
});

export async function getViewer(): Promise<Viewer | null> {
  return (await getViewerContext())?.viewer ?? null;
}

/** Signed out → /sign-in?next=<this page>; signed in without the role → the 403 page. */
export async function requireViewer(options?: { role?: Role | Role[] }): Promise<Viewer> {
  const viewer = await getViewer();
  if (!viewer) {
    // proxy.ts copies the requested path into this header; actions fall back to the desk.
    const path = (await headers()).get("x-sealpitch-path") ?? "/desk";
    redirect(`/sign-in?next=${encodeURIComponent(path)}`);
  }
  if (!hasRole(viewer, options?.role)) forbidden();
  return viewer;
}

export function jsonError(status: number, message: string, fieldErrors?: Record<string, string[]>): Response {
  return Response.json(
    { error: fieldErrors ? { message, fieldErrors } : { message } },
    { status, headers: cacheControl("fresh") },
  );
}

/** 503 with Retry-After: the database cannot be reached now; the same request will work once it is back. */
export function databaseUnavailableResponse(): Response {
  return Response.json(
    {
      error: {
        message: `Sealpitch cannot reach its database just now. Nothing was changed; try again in ${DATABASE_RETRY_AFTER_SECONDS} seconds.`,
      },
    },
    {
      status: 503,
      headers: { ...cacheControl("fresh"), "retry-after": String(DATABASE_RETRY_AFTER_SECONDS) },
    },
  );
}

/** True when a state-changing request comes from our own origin (CSRF defence for route handlers). */
export function isSameOrigin(request: Request): boolean {
  const origin = request.headers.get("origin");
  return origin !== null && origin === new URL(getEnv().APP_URL).origin;
}

/**
 * Route handlers: reads the session cookie from the Request itself (so handlers work outside
 * Next's request scope, e.g. called directly in vitest). 401 signed out, 403 wrong role or, for
 * anything but GET/HEAD, a foreign or missing Origin.
 */
export async function authorizeApi(
  request: Request,
  options?: { role?: Role | Role[] },
): Promise<{ ok: true; viewer: Viewer } | { ok: false; response: Response }> {
  const method = request.method.toUpperCase();
  if (method !== "GET" && method !== "HEAD" && !isSameOrigin(request)) {
    return { ok: false, response: jsonError(403, "This request did not come from Sealpitch.") };
  }
  const sessionId = getLucia().readSessionCookie(request.headers.get("cookie") ?? "");
  // Every API route starts here, and the session lookup is its first database query: an outage is
  // answered in this one place with a JSON 503 and Retry-After, never an empty 500 (the pool
  // reconnects by itself once the database is back). The cause goes to the server log only.
  let context: ViewerContext | null;
  try {
    context = await resolveViewerContext(sessionId);
  } catch (error) {
    if (!isDatabaseUnavailable(error)) throw error;
    console.error(`[api] database unavailable: ${error instanceof Error ? error.message : String(error)}`);
    return { ok: false, response: databaseUnavailableResponse() };
  }
  if (!context) return { ok: false, response: jsonError(401, "Sign in to continue.") };
  if (!hasRole(context.viewer, options?.role)) {
    return { ok: false, response: jsonError(403, "Your role in this organisation does not allow this.") };
  }
  return { ok: true, viewer: context.viewer };
}
