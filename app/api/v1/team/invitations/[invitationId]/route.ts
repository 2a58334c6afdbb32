import { resendInvitationCommand, revokeInvitationCommand } from "@/features/accounts/team-commands";
import { authorizeApi, jsonError } from "@/server/auth/guard";

type Context = { params: Promise<{ invitationId: string }> };

/** Resend with a new link. */
export async function POST(request: Request, context: Context): Promise<Response> {
  const auth = await authorizeApi(request, { role: "admin" });
  if (!auth.ok) return auth.response;
  const result = await resendInvitationCommand(auth.viewer, await context.params);
  return result.ok
    ? new Response(null, { status: 204 })
    : jsonError(result.status, result.message, result.fieldErrors);
}

/** Revoke. */
export async function DELETE(request: Request, context: Context): Promise<Response> {
  const auth = await authorizeApi(request, { role: "admin" });
  if (!auth.ok) return auth.response;
  const result = await revokeInvitationCommand(auth.viewer, await context.params);
  return result.ok
    ? new Response(null, { status: 204 })
    : jsonError(result.status, result.message, result.fieldErrors);
}
