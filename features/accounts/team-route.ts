import "server-only";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import type { Viewer } from "@/server/auth/viewer";
import type { CommandResult } from "./team-commands";

/**
 * A /api/v1/team route handler that changes one member or invitation: admin only; `run` gets the
 * viewer and the route's params and returns the command's result (or its own early response, such
 * as a refused body); success is 204 without a body, a refusal the command's status and message.
 */
export function crewCommandHandler<P>(
  run: (viewer: Viewer, params: P, request: Request) => Promise<CommandResult | Response>,
): (request: Request, context: { params: Promise<P> }) => Promise<Response> {
  return async (request, context) => {
    const auth = await authorizeApi(request, { role: "admin" });
    if (!auth.ok) return auth.response;
    const result = await run(auth.viewer, await context.params, request);
    if (result instanceof Response) return result;
    return result.ok
      ? new Response(null, { status: 204 })
      : jsonError(result.status, result.message, result.fieldErrors);
  };
}
