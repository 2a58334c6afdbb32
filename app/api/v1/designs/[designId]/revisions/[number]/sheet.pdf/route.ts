import { exportFileName } from "@/features/exports/file-names";
import { enqueueSheetJob } from "@/features/exports/sheet-job";
import { logExport, prepareSheetExport as prepare, servePdfExport } from "@/features/exports/sheet-request";
import { renderSpacingSheet } from "@/features/exports/sheet/render-sheet";
import { withRequestLog } from "@/server/log/with-logging";
import { cacheControl } from "@/server/http/cache-control";

type Context = { params: Promise<{ designId: string; number: string }> };

// The bolt-spacing sheet of one stored revision. GET renders it in the request (any size; the
// export buttons use it below 64 bolts); POST queues it as a background job and answers 202 with
// the job to poll at /api/v1/jobs/[jobId]. Any member of the organisation may export.
async function handleGET(request: Request, { params }: Context) {
  return servePdfExport(request, params, "spacing-sheet", renderSpacingSheet);
}

async function handlePOST(request: Request, { params }: Context) {
  const p = await prepare(request, params);
  if ("response" in p) return p.response;
  const { revision } = p.loaded;
  const jobId = await enqueueSheetJob(p.db, {
    organizationId: p.viewer.organizationId,
    designId: revision.designId,
    revisionId: revision.revisionId,
    designName: revision.designName,
    equipmentTag: revision.equipmentTag,
    requestedBy: p.viewer.userId,
    revisionNumber: revision.number,
    paper: p.paper,
    units: p.units,
  });
  const fileName = exportFileName(revision, revision.number, "spacing-sheet");
  await logExport(
    p.db,
    p.viewer,
    revision.designId,
    revision.revisionId,
    `${fileName} (${p.paper.toUpperCase()}, ${p.units}, queued)`,
  );
  return Response.json(
    { jobId, statusUrl: `/api/v1/jobs/${jobId}` },
    { status: 202, headers: { location: `/api/v1/jobs/${jobId}`, ...cacheControl("userData") } },
  );
}

export const GET = withRequestLog("/api/v1/designs/[designId]/revisions/[number]/sheet.pdf", handleGET);
export const POST = withRequestLog("/api/v1/designs/[designId]/revisions/[number]/sheet.pdf", handlePOST);
