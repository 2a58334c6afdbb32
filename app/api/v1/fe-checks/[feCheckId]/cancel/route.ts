import { cacheControl } from "@/server/http/cache-control";
import { getDb } from "@/db/index";
import { cancelFeCheck } from "@/features/fe-check/commands";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";

type Context = { params: Promise<{ feCheckId: string }> };

// POST (no body): cancel a queued or running FE cross-check → { feCheck }. A queued run ends at
// once; a running one stops within a few seconds (its solver is killed) and stores nothing.
async function handlePOST(request: Request, { params }: Context) {
  const auth = await authorizeApi(request, { role: ["designer", "approver"] });
  if (!auth.ok) return auth.response;
  const result = await cancelFeCheck(getDb(), auth.viewer, (await params).feCheckId);
  if (!result.ok) return jsonError(result.status, result.message);
  return Response.json({ feCheck: result.data }, { headers: cacheControl("userData") });
}

export const POST = withRequestLog("/api/v1/fe-checks/[feCheckId]/cancel", handlePOST);
