import { getDb } from "@/db/index";
import { recordActivity } from "@/features/activity/queries";
import { CONTENT_TYPES, exportFileName } from "@/features/exports/file-names";
import { fileResponse, parseExportPath } from "@/features/exports/http";
import { findExportRevision } from "@/features/exports/queries";
import { holeListFor } from "@/features/exports/shop-files";
import { authorizeApi, jsonError } from "@/server/auth/guard";

type Context = { params: Promise<{ designId: string; number: string }> };

// The hole list (CSV) of one stored revision, in the design's own length unit.
export async function GET(request: Request, { params }: Context) {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const path = parseExportPath(await params);
  const db = getDb();
  const revision = path ? await findExportRevision(db, auth.viewer.organizationId, path.designId, path.number) : undefined;
  if (!revision) return jsonError(404, "This revision does not exist.");
  const fileName = exportFileName(revision, revision.number, "hole-list");
  const body = holeListFor(revision.document, revision.result);
  try {
    await recordActivity(db, { organizationId: auth.viewer.organizationId, designId: revision.designId, revisionId: revision.revisionId, actorId: auth.viewer.userId, kind: "exported", detail: fileName });
  } catch (error) {
    console.error(`[exports] activity not recorded: ${error instanceof Error ? error.message : String(error)}`);
  }
  return fileResponse(body, fileName, CONTENT_TYPES["hole-list"]);
}
