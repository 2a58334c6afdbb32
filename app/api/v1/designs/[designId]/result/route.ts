import { getDb } from "@/db/index";
import { jsonWithEntityTag } from "@/features/designs/http";
import { findWorkingResultJson } from "@/features/designs/queries";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";

type Context = { params: Promise<{ designId: string }> };

// The working revision's whole stored result, sampled profiles included: what the design read
// (GET /api/v1/designs/[id]) carried in `workingRevision.result` before it left the profiles out.
// `{ designId, revisionNumber, version, result }`, with an ETag like the design read. The result
// is the database's own JSON text of the stored column, sent on without being parsed here.
async function handleGET(request: Request, { params }: Context): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const designId = (await params).designId;
  const stored = await findWorkingResultJson(getDb(), auth.viewer.organizationId, designId);
  if (!stored) return jsonError(404, "This design does not exist in your organisation.");
  const head = JSON.stringify({ designId, revisionNumber: stored.revisionNumber, version: stored.version });
  return jsonWithEntityTag(request, `${head.slice(0, -1)},"result":${stored.resultJson ?? "null"}}`);
}

export const GET = withRequestLog("/api/v1/designs/[designId]/result", handleGET);
