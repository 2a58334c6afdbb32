import "server-only";
import { createHash } from "node:crypto";
import { jsonError } from "@/server/auth/guard";
import type { CommandFailureReason, CommandResult } from "./commands";
import type { DesignReadDto } from "./queries";
import { cacheControl } from "@/server/http/cache-control";

// JSON plumbing shared by the /api/v1 designs route handlers.
const STATUS: Record<CommandFailureReason, number> = {
  invalid: 422,
  "not-found": 404,
  forbidden: 403,
  conflict: 409,
  frozen: 409,
};

export const NO_STORE = cacheControl("userData");

/** True when an If-None-Match header names this entity tag (weak comparison, RFC 9110 §13.1.2). */
function matchesEntityTag(ifNoneMatch: string | null, etag: string): boolean {
  if (!ifNoneMatch) return false;
  if (ifNoneMatch.trim() === "*") return true;
  const opaque = (tag: string) => tag.trim().replace(/^W\//, "");
  return ifNoneMatch.split(",").some((tag) => opaque(tag) === opaque(etag));
}

/**
 * A JSON body with a weak ETag of its bytes. A request whose If-None-Match names that tag gets a
 * 304 without the body; the read itself still runs, so the answer is never stale.
 */
export function jsonWithEntityTag(request: Request, json: string): Response {
  const etag = `W/"${createHash("sha256").update(json).digest("base64url")}"`;
  const headers = { ...cacheControl("revalidate"), etag };
  if (matchesEntityTag(request.headers.get("if-none-match"), etag))
    return new Response(null, { status: 304, headers });
  return new Response(json, { headers: { ...headers, "content-type": "application/json" } });
}

export function commandResponse<T>(result: CommandResult<T>, successStatus = 200): Response {
  if (result.ok) return Response.json(result.data, { status: successStatus, headers: NO_STORE });
  const response = jsonError(STATUS[result.reason], result.message, result.fieldErrors);
  if (!result.conflict) return response;
  return Response.json(
    { error: { message: result.message, conflict: true } },
    { status: 409, headers: NO_STORE },
  );
}

/**
 * What GET /api/v1/designs/[id] returns: the design with its working revision, whose `result` is
 * the stored result without `gasketStress.profile`; `resultUrl` answers the whole result.
 */
export function toApiDesign(design: DesignReadDto) {
  return {
    designId: design.designId,
    name: design.name,
    equipmentTag: design.equipmentTag,
    outlineKind: design.outlineKind,
    ownerId: design.ownerId,
    ownerName: design.ownerName,
    archived: design.archived,
    updatedAt: design.updatedAt,
    workingRevision: {
      number: design.revisionNumber,
      status: design.status,
      version: design.version,
      document: design.document,
      result: design.result,
      resultUrl: `/api/v1/designs/${design.designId}/result`,
      coreVersion: design.coreVersion,
      lastEditedByName: design.lastEditedByName,
      updatedAt: design.revisionUpdatedAt,
    },
  };
}
