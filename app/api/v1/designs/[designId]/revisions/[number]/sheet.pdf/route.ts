import { getDb } from "@/db/index";
import { recordActivity } from "@/features/activity/queries";
import { CONTENT_TYPES, exportFileName } from "@/features/exports/file-names";
import { fileResponse, parseExportPath, parseSheetOptions } from "@/features/exports/http";
import { authorizeApi, jsonError, type Viewer } from "@/server/auth/guard";
import { enqueueSheetJob } from "@/features/exports/sheet-job";
import { loadSheetInput } from "@/features/exports/sheet/load-sheet-input";
import { renderSpacingSheet } from "@/features/exports/sheet/render-sheet";
import { withRequestLog } from "@/server/log/with-logging";
import { errorText, getLogger } from "@/server/log/logger";

type Context = { params: Promise<{ designId: string; number: string }> };

// The bolt-spacing sheet of one stored revision. GET renders it in the request (any size; the
// export buttons use it below 64 bolts); POST queues it as a background job and answers 202 with
// the job to poll at /api/v1/jobs/[jobId]. Any member of the organisation may export.
type Prepared =
  | { response: Response }
  | {
      viewer: Viewer;
      db: ReturnType<typeof getDb>;
      loaded: NonNullable<Awaited<ReturnType<typeof loadSheetInput>>>;
      paper: "a4" | "letter";
      units: "SI" | "US";
    };

async function prepare(request: Request, params: Context["params"]): Promise<Prepared> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return { response: auth.response };
  const path = parseExportPath(await params);
  if (!path) return { response: jsonError(404, "This revision does not exist.") };
  const options = parseSheetOptions(new URL(request.url));
  if (!options.ok) return { response: jsonError(400, options.message, options.fieldErrors) };
  const viewer = auth.viewer;
  const paper = options.data.paper;
  const units = options.data.units ?? viewer.unitSystem;
  const db = getDb();
  const loaded = await loadSheetInput(db, viewer.organizationId, path.designId, path.number, {
    paper,
    units,
    createdAt: new Date(),
  });
  if (!loaded) return { response: jsonError(404, "This revision does not exist.") };
  if (!loaded.revision.result)
    return {
      response: jsonError(409, "This revision has no stored result to print; save it again to analyse it."),
    };
  return { viewer, db, loaded, paper, units };
}

async function logExport(
  db: ReturnType<typeof getDb>,
  viewer: { organizationId: string; userId: string },
  designId: string,
  revisionId: string,
  detail: string,
) {
  try {
    await recordActivity(db, {
      organizationId: viewer.organizationId,
      designId,
      revisionId,
      actorId: viewer.userId,
      kind: "exported",
      detail,
    });
  } catch (error) {
    getLogger().error({ event: "activity", err: errorText(error) }, "export activity not recorded");
  }
}

async function handleGET(request: Request, { params }: Context) {
  const p = await prepare(request, params);
  if ("response" in p) return p.response;
  const { revision, input } = p.loaded;
  const bytes = await renderSpacingSheet(input);
  const fileName = exportFileName(revision, revision.number, "spacing-sheet");
  await logExport(
    p.db,
    p.viewer,
    revision.designId,
    revision.revisionId,
    `${fileName} (${p.paper.toUpperCase()}, ${p.units})`,
  );
  return fileResponse(bytes, fileName, CONTENT_TYPES["spacing-sheet"]);
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
    { status: 202, headers: { location: `/api/v1/jobs/${jobId}`, "cache-control": "no-store" } },
  );
}

export const GET = withRequestLog("/api/v1/designs/[designId]/revisions/[number]/sheet.pdf", handleGET);
export const POST = withRequestLog("/api/v1/designs/[designId]/revisions/[number]/sheet.pdf", handlePOST);
