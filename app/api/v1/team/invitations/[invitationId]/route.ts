import { resendInvitationCommand, revokeInvitationCommand } from "@/features/accounts/team-commands";
import { crewCommandHandler } from "@/features/accounts/team-route";
import { withRequestLog } from "@/server/log/with-logging";

const ROUTE = "/api/v1/team/invitations/[invitationId]";

/** Resend with a new link. */
export const POST = withRequestLog(
  ROUTE,
  crewCommandHandler<{ invitationId: string }>(resendInvitationCommand),
);

/** Revoke. */
export const DELETE = withRequestLog(
  ROUTE,
  crewCommandHandler<{ invitationId: string }>(revokeInvitationCommand),
);
