import { getDb } from "@/db/index";
import { createDesignFromApi } from "@/features/designs/commands";
import { NO_STORE, commandResponse } from "@/features/designs/http";
import { listDesigns } from "@/features/designs/queries";
import { listDesignsQuerySchema, searchParamsToObject } from "@/features/designs/schema";
import { readJsonBody } from "@/server/http/request-body";
import { authorizeApi } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";

// GET: the Joint register as JSON (same query parameters as /designs: q, status, owner, outline,
// updatedWithinDays, sort, dir, page, archived). POST: a new design from a template or a document.
async function handleGET(request: Request): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const query = listDesignsQuerySchema.parse(searchParamsToObject(new URL(request.url).searchParams));
  return Response.json(await listDesigns(getDb(), auth.viewer.organizationId, query), { headers: NO_STORE });
}

async function handlePOST(request: Request): Promise<Response> {
  const auth = await authorizeApi(request, { role: "designer" });
  if (!auth.ok) return auth.response;
  const body = await readJsonBody(request);
  if (!body.ok) return body.response;
  return commandResponse(await createDesignFromApi(getDb(), auth.viewer, body.body), 201);
}

export const GET = withRequestLog("/api/v1/designs", handleGET);
export const POST = withRequestLog("/api/v1/designs", handlePOST);
