import { getDb } from "@/db/index";
import { deleteDesignForViewer, saveWorkingRevisionForViewer } from "@/features/designs/commands";
import { commandResponse, jsonWithEntityTag, toApiDesign } from "@/features/designs/http";
import { findDesignRead } from "@/features/designs/queries";
import { designIdSchema } from "@/features/designs/schema";
import { readJsonBody } from "@/server/http/request-body";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";

type Context = { params: Promise<{ designId: string }> };

// One design. GET answers the working revision with its result less the sampled profiles (those are
// GET …/result), with an ETag: If-None-Match with the same tag is a 304 without a body. PUT saves its working revision: the body carries `baseVersion`, and a save based on
// an older version is refused with 409 (nothing written). DELETE only for never-submitted drafts.
async function handleGET(request: Request, { params }: Context): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const design = await findDesignRead(getDb(), auth.viewer.organizationId, (await params).designId);
  if (!design) return jsonError(404, "This design does not exist in your organisation.");
  return jsonWithEntityTag(request, JSON.stringify(toApiDesign(design)));
}

async function handlePUT(request: Request, { params }: Context): Promise<Response> {
  const auth = await authorizeApi(request, { role: "designer" });
  if (!auth.ok) return auth.response;
  const body = await readJsonBody(request);
  if (!body.ok) return body.response;
  const designId = (await params).designId;
  if (!designIdSchema.safeParse(designId).success)
    return jsonError(404, "This design does not exist in your organisation.");
  const fields = body.body && typeof body.body === "object" && !Array.isArray(body.body) ? body.body : {};
  return commandResponse(await saveWorkingRevisionForViewer(getDb(), auth.viewer, { ...fields, designId }));
}

async function handleDELETE(request: Request, { params }: Context): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const result = await deleteDesignForViewer(getDb(), auth.viewer, (await params).designId);
  return result.ok ? new Response(null, { status: 204 }) : commandResponse(result);
}

export const GET = withRequestLog("/api/v1/designs/[designId]", handleGET);
export const PUT = withRequestLog("/api/v1/designs/[designId]", handlePUT);
export const DELETE = withRequestLog("/api/v1/designs/[designId]", handleDELETE);
