import { resendInvitationCommand, revokeInvitationCommand } from "@/features/accounts/team-commands";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";

type Context = { params: Promise<{ invitationId: string }> };

/** Resend with a new link. */
async function handlePOST(request: Request, context: Context): Promise<Response> {
  const auth = await authorizeApi(request, { role: "admin" });
  if (!auth.ok) return auth.response;
  const result = await resendInvitationCommand(auth.viewer, await context.params);
  return result.ok
    ? new Response(null, { status: 204 })
    : jsonError(result.status, result.message, result.fieldErrors);
}

/** Revoke. */
async function handleDELETE(request: Request, context: Context): Promise<Response> {
  const auth = await authorizeApi(request, { role: "admin" });
  if (!auth.ok) return auth.response;
  const result = await revokeInvitationCommand(auth.viewer, await context.params);
  return result.ok
    ? new Response(null, { status: 204 })
    : jsonError(result.status, result.message, result.fieldErrors);
}

export const POST = withRequestLog("/api/v1/team/invitations/[invitationId]", handlePOST);
export const DELETE = withRequestLog("/api/v1/team/invitations/[invitationId]", handleDELETE);
