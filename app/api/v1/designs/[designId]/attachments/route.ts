import { getDb } from "@/db/index";
import { decodeFileNameHeader, idParamSchema, uploadHeadersSchema } from "@/features/attachments/http";
import { MAX_ATTACHMENT_BYTES } from "@/features/attachments/model/dto";
import { checkUpload, uploadAttachment } from "@/features/attachments/mutations";
import { listAttachments } from "@/features/attachments/queries";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { withRequestLog } from "@/server/log/with-logging";
import { readBodyWithLimit } from "@/server/http/request-body";
import { cacheControl } from "@/server/http/cache-control";

type Context = { params: Promise<{ designId: string }> };

// GET: the design's attachments. POST: upload one file; the body is the raw file, its name in
// the X-File-Name header (URI-encoded). Origin, role, size and content are checked in that order.
async function handleGET(request: Request, { params }: Context) {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const id = idParamSchema.safeParse((await params).designId);
  const list = id.success ? await listAttachments(getDb(), auth.viewer.organizationId, id.data) : null;
  if (!list) return jsonError(404, "This design does not exist.");
  return Response.json(list, { headers: cacheControl("userData") });
}

async function handlePOST(request: Request, { params }: Context) {
  const auth = await authorizeApi(request, { role: ["designer", "admin"] });
  if (!auth.ok) return auth.response;
  const parsed = uploadHeadersSchema.safeParse({
    designId: (await params).designId,
    fileName: decodeFileNameHeader(request.headers.get("x-file-name")),
  });
  if (!parsed.success) {
    const fieldErrors = parsedFieldErrors(parsed.error);
    if (fieldErrors.designId) return jsonError(404, "This design does not exist.");
    return jsonError(400, fieldErrors.fileName?.[0] ?? "The upload is not valid.", fieldErrors);
  }
  const declared = Number(request.headers.get("content-length"));
  const bytes =
    Number.isFinite(declared) && declared > MAX_ATTACHMENT_BYTES
      ? null
      : await readBodyWithLimit(request, MAX_ATTACHMENT_BYTES);
  if (!bytes) {
    return jsonError(
      413,
      `The file is larger than ${MAX_ATTACHMENT_BYTES / 1024 / 1024} MB: attachments may be at most ${MAX_ATTACHMENT_BYTES / 1024 / 1024} MB.`,
    );
  }
  const precheck = checkUpload(parsed.data.fileName, bytes);
  if (!precheck.ok) return jsonError(precheck.status, precheck.message);
  const result = await uploadAttachment(
    getDb(),
    auth.viewer,
    parsed.data.designId,
    parsed.data.fileName,
    bytes,
  );
  if (!result.ok) return jsonError(result.status, result.message);
  return Response.json(result.data, { status: 201 });
}

function parsedFieldErrors(error: import("zod").ZodError): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const issue of error.issues) (out[String(issue.path[0])] ??= []).push(issue.message);
  return out;
}

export const GET = withRequestLog("/api/v1/designs/[designId]/attachments", handleGET);
export const POST = withRequestLog("/api/v1/designs/[designId]/attachments", handlePOST);
