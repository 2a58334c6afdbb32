import "server-only";
import { getDb } from "@/db/index";
import { recordActivity } from "@/features/activity/queries";
import { authorizeApi, jsonError, type Viewer } from "@/server/auth/guard";
import { errorText, getLogger } from "@/server/log/logger";
import { CONTENT_TYPES, exportFileName } from "./file-names";
import { fileResponse, parseExportPath, parseSheetOptions } from "./http";
import { loadSheetInput } from "./sheet/load-sheet-input";
import type { SheetInput } from "./sheet/sheet-input";

// The shared steps of the routes that render a PDF of one stored revision (the bolt-spacing sheet,
// the Pass log): read and authorise the request, load the revision, and log the export.
export type Prepared =
  | { response: Response }
  | {
      viewer: Viewer;
      db: ReturnType<typeof getDb>;
      loaded: NonNullable<Awaited<ReturnType<typeof loadSheetInput>>>;
      paper: "a4" | "letter";
      units: "SI" | "US";
    };

/**
 * Reads a sheet request of one stored revision: signed in, the path, `paper` and `units` (default:
 * the viewer's unit system), the revision with its stored result. Any refusal is a JSON response.
 */
export async function prepareSheetExport(
  request: Request,
  params: Promise<{ designId: string; number: string }>,
): Promise<Prepared> {
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

/** Writes the export to the design's activity log; a failure is logged and does not fail the download. */
export async function logExport(
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

/** GET of a PDF of one stored revision, rendered in the request, logged, with our file name. */
export async function servePdfExport(
  request: Request,
  params: Promise<{ designId: string; number: string }>,
  kind: "spacing-sheet" | "pass-log-sheet",
  render: (input: SheetInput) => Promise<Buffer>,
): Promise<Response> {
  const p = await prepareSheetExport(request, params);
  if ("response" in p) return p.response;
  const { revision, input } = p.loaded;
  const bytes = await render(input);
  const fileName = exportFileName(revision, revision.number, kind);
  await logExport(
    p.db,
    p.viewer,
    revision.designId,
    revision.revisionId,
    `${fileName} (${p.paper.toUpperCase()}, ${p.units})`,
  );
  return fileResponse(bytes, fileName, CONTENT_TYPES[kind]);
}
