import "server-only";
import { getDb } from "@/db/index";
import { recordActivity } from "@/features/activity/queries";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { CONTENT_TYPES, exportFileName } from "./file-names";
import { fileResponse, parseExportPath } from "./http";
import { findExportRevision, type ExportRevisionDto } from "./queries";
import { boltingKitFor, drillingTemplateFor, holeListFor, passLogFor } from "./shop-files";
import { errorText, getLogger } from "@/server/log/logger";

const BUILDERS = {
  "hole-list": (r: ExportRevisionDto) => holeListFor(r.document, r.result),
  "drilling-template": (r: ExportRevisionDto) => drillingTemplateFor(r.document, r.result, r),
  "bolting-kit": (r: ExportRevisionDto) => boltingKitFor(r.document, r.result),
  "pass-log": (r: ExportRevisionDto) => passLogFor(r.document, r.result),
} as const;

/**
 * One stored revision's shop file (hole list CSV, drilling template DXF, Bolting kit or Pass log CSV), for any
 * member of the organisation; another organisation's design is a 404. Each download is written to the activity log.
 */
export async function serveShopFile(
  request: Request,
  params: { designId: string; number: string },
  kind: keyof typeof BUILDERS,
): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const path = parseExportPath(params);
  const db = getDb();
  const revision = path
    ? await findExportRevision(db, auth.viewer.organizationId, path.designId, path.number)
    : undefined;
  if (!revision) return jsonError(404, "This revision does not exist.");
  const fileName = exportFileName(revision, revision.number, kind);
  const body = BUILDERS[kind](revision);
  try {
    await recordActivity(db, {
      organizationId: auth.viewer.organizationId,
      designId: revision.designId,
      revisionId: revision.revisionId,
      actorId: auth.viewer.userId,
      kind: "exported",
      detail: fileName,
    });
  } catch (error) {
    getLogger().error({ event: "activity", err: errorText(error) }, "export activity not recorded");
  }
  return fileResponse(body, fileName, CONTENT_TYPES[kind]);
}
