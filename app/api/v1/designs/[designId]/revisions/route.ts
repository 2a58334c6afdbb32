import { z } from "zod";
import { getDb } from "@/db/index";
import { listRevisionSummaries } from "@/features/reviews/queries";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";
import { cacheControl } from "@/server/http/cache-control";

// Every revision of a design: number, status, content hash and times (no documents).
async function handleGET(
  request: Request,
  context: { params: Promise<{ designId: string }> },
): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const { designId } = await context.params;
  if (!z.uuid().safeParse(designId).success) return jsonError(404, "No such design.");
  const revisions = await listRevisionSummaries(getDb(), auth.viewer.organizationId, designId);
  if (revisions.length === 0) return jsonError(404, "No such design.");
  return Response.json({ revisions }, { headers: cacheControl("userData") });
}

export const GET = withRequestLog("/api/v1/designs/[designId]/revisions", handleGET);
