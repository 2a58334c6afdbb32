import { cacheControl } from "@/server/http/cache-control";
import { getDb } from "@/db/index";
import { readLatestFeCheck, startFeCheck } from "@/features/fe-check/commands";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";

type Context = { params: Promise<{ designId: string; number: string }> };

// GET: the revision's latest FE cross-check ({ feCheck: null } before the first run): status,
// stage, progress, and when done the result with the estimate-against-FE table. POST (no body):
// queue a run of the revision's saved document → 202 { feCheck }. Designers and approvers.
async function handleGET(request: Request, { params }: Context) {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const result = await readLatestFeCheck(getDb(), auth.viewer, await params);
  if (!result.ok) return jsonError(result.status, result.message);
  return Response.json({ feCheck: result.data }, { headers: cacheControl("userData") });
}

async function handlePOST(request: Request, { params }: Context) {
  const auth = await authorizeApi(request, { role: ["designer", "approver"] });
  if (!auth.ok) return auth.response;
  const result = await startFeCheck(getDb(), auth.viewer, await params);
  if (!result.ok) return jsonError(result.status, result.message);
  return Response.json({ feCheck: result.data }, { status: 202, headers: cacheControl("userData") });
}

export const GET = withRequestLog("/api/v1/designs/[designId]/revisions/[number]/fe-check", handleGET);
export const POST = withRequestLog("/api/v1/designs/[designId]/revisions/[number]/fe-check", handlePOST);
