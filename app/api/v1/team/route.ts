import { getDb } from "@/db/index";
import { getTeam } from "@/features/accounts/team";
import { inviteMemberCommand } from "@/features/accounts/team-commands";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";
import { readJsonBody } from "@/server/http/request-body";
import { cacheControl } from "@/server/http/cache-control";

// The Crew (members and open invitations) of the viewer's organisation. Admin only.
async function handleGET(request: Request): Promise<Response> {
  const auth = await authorizeApi(request, { role: "admin" });
  if (!auth.ok) return auth.response;
  return Response.json(await getTeam(getDb(), auth.viewer.organizationId), {
    headers: cacheControl("userData"),
  });
}

/** Invite: { email, roles }. */
async function handlePOST(request: Request): Promise<Response> {
  const auth = await authorizeApi(request, { role: "admin" });
  if (!auth.ok) return auth.response;
  const body = await readJsonBody(request);
  if (!body.ok) return body.response;
  const result = await inviteMemberCommand(auth.viewer, body.body);
  return result.ok
    ? Response.json(result.data, { status: 201 })
    : jsonError(result.status, result.message, result.fieldErrors);
}

export const GET = withRequestLog("/api/v1/team", handleGET);
export const POST = withRequestLog("/api/v1/team", handlePOST);
