import { changeMemberRolesCommand, removeMemberCommand } from "@/features/accounts/team-commands";
import { crewCommandHandler } from "@/features/accounts/team-route";
import { withRequestLog } from "@/server/log/with-logging";
import { readJsonBody } from "@/server/http/request-body";

const ROUTE = "/api/v1/team/members/[userId]";

/** Change a member's roles: { roles }. */
export const PATCH = withRequestLog(
  ROUTE,
  crewCommandHandler(async (viewer, { userId }: { userId: string }, request) => {
    const body = await readJsonBody(request);
    if (!body.ok) return body.response;
    const fields = body.body as { roles?: unknown } | null;
    return changeMemberRolesCommand(viewer, { userId, roles: fields?.roles });
  }),
);

export const DELETE = withRequestLog(
  ROUTE,
  crewCommandHandler((viewer, { userId }: { userId: string }) => removeMemberCommand(viewer, { userId })),
);
