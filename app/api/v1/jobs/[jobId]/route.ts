import { getDb } from "@/db/index";
import { jobIdSchema } from "@/features/exports/schema";
import { fileResponse } from "@/features/exports/http";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { findExportFileBytes, findExportJob } from "@/server/jobs/export-files";
import { withRequestLog } from "@/server/log/with-logging";
import { cacheControl } from "@/server/http/cache-control";

type Context = { params: Promise<{ jobId: string }> };

// Status of a background export ({ jobId, status, progress, fileName, downloadUrl, error }) and,
// with ?download=1, the finished file. Another organisation's job is a 404.
async function handleGET(request: Request, { params }: Context) {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const parsed = jobIdSchema.safeParse((await params).jobId);
  if (!parsed.success) return jsonError(404, "This export job does not exist.");
  const db = getDb();
  if (new URL(request.url).searchParams.get("download") === "1") {
    const file = await findExportFileBytes(db, auth.viewer.organizationId, parsed.data);
    if (file) return fileResponse(file.bytes, file.fileName, file.contentType);
    const job = await findExportJob(db, auth.viewer.organizationId, parsed.data);
    return job
      ? jsonError(409, "This export is not finished yet.")
      : jsonError(404, "This export job does not exist.");
  }
  const job = await findExportJob(db, auth.viewer.organizationId, parsed.data);
  if (!job) return jsonError(404, "This export job does not exist.");
  return Response.json(job, { headers: cacheControl("userData") });
}

export const GET = withRequestLog("/api/v1/jobs/[jobId]", handleGET);
