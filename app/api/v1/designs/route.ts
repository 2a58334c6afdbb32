import { getDb } from "@/db/index";
import { createDesignFromApi } from "@/features/designs/commands";
import { NO_STORE, commandResponse } from "@/features/designs/http";
import { listDesigns } from "@/features/designs/queries";
import { listDesignsQuerySchema, searchParamsToObject } from "@/features/designs/schema";
import { readJsonBody } from "@/server/http/request-body";
import { authorizeApi } from "@/server/auth/guard";

// GET: the Joint register as JSON (same query parameters as /designs: q, status, owner, outline,
// updatedWithinDays, sort, dir, page, archived). POST: a new design from a template or a document.
export async function GET(request: Request): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const query = listDesignsQuerySchema.parse(searchParamsToObject(new URL(request.url).searchParams));
  return Response.json(await listDesigns(getDb(), auth.viewer.organizationId, query), { headers: NO_STORE });
}

export async function POST(request: Request): Promise<Response> {
  const auth = await authorizeApi(request, { role: "designer" });
  if (!auth.ok) return auth.response;
  const body = await readJsonBody(request);
  if (!body.ok) return body.response;
  return commandResponse(await createDesignFromApi(getDb(), auth.viewer, body.body), 201);
}
