import { getDb } from "@/db/index";
import { contentDisposition, idParamSchema } from "@/features/attachments/http";
import { deleteAttachment } from "@/features/attachments/mutations";
import { findAttachment } from "@/features/attachments/queries";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { getBlob } from "@/server/storage/blob-store";
import { withRequestLog } from "@/server/log/with-logging";
import { cacheControl } from "@/server/http/cache-control";

type Context = { params: Promise<{ designId: string; attachmentId: string }> };

async function ids(params: Context["params"]) {
  const p = await params;
  const d = idParamSchema.safeParse(p.designId);
  const a = idParamSchema.safeParse(p.attachmentId);
  return d.success && a.success ? { designId: d.data, attachmentId: a.data } : null;
}

// GET downloads the stored bytes exactly as uploaded; another organisation's id is a 404.
async function handleGET(request: Request, { params }: Context) {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const key = await ids(params);
  const db = getDb();
  const attachment = key
    ? await findAttachment(db, auth.viewer.organizationId, key.designId, key.attachmentId)
    : null;
  const bytes = attachment ? await getBlob(db, auth.viewer.organizationId, attachment.blobId) : null;
  if (!attachment || !bytes) return jsonError(404, "This attachment does not exist.");
  return new Response(new Uint8Array(bytes), {
    headers: {
      "content-type": attachment.contentType,
      "content-length": String(bytes.byteLength),
      "content-disposition": contentDisposition(attachment.fileName),
      "x-content-type-options": "nosniff",
      ...cacheControl("userData"),
    },
  });
}

async function handleDELETE(request: Request, { params }: Context) {
  const auth = await authorizeApi(request, { role: ["designer", "admin"] });
  if (!auth.ok) return auth.response;
  const key = await ids(params);
  if (!key) return jsonError(404, "This attachment does not exist.");
  const result = await deleteAttachment(getDb(), auth.viewer, key.designId, key.attachmentId);
  if (!result.ok) return jsonError(result.status, result.message);
  return Response.json(result.data);
}

export const GET = withRequestLog("/api/v1/designs/[designId]/attachments/[attachmentId]", handleGET);
export const DELETE = withRequestLog("/api/v1/designs/[designId]/attachments/[attachmentId]", handleDELETE);
