import { changeMemberRolesCommand, removeMemberCommand } from "@/features/accounts/team-commands";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";
import { readJsonBody } from "@/server/http/request-body";

type Context = { params: Promise<{ userId: string }> };

/** Change a member's roles: { roles }. */
async function handlePATCH(request: Request, context: Context): Promise<Response> {
  const auth = await authorizeApi(request, { role: "admin" });
  if (!auth.ok) return auth.response;
  const { userId } = await context.params;
  const body = await readJsonBody(request);
  if (!body.ok) return body.response;
  const fields = body.body as { roles?: unknown } | null;
  const result = await changeMemberRolesCommand(auth.viewer, { userId, roles: fields?.roles });
  return result.ok
    ? new Response(null, { status: 204 })
    : jsonError(result.status, result.message, result.fieldErrors);
}

async function handleDELETE(request: Request, context: Context): Promise<Response> {
  const auth = await authorizeApi(request, { role: "admin" });
  if (!auth.ok) return auth.response;
  const { userId } = await context.params;
  const result = await removeMemberCommand(auth.viewer, { userId });
  return result.ok
    ? new Response(null, { status: 204 })
    : jsonError(result.status, result.message, result.fieldErrors);
}

export const PATCH = withRequestLog("/api/v1/team/members/[userId]", handlePATCH);
export const DELETE = withRequestLog("/api/v1/team/members/[userId]", handleDELETE);
