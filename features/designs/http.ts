import "server-only";
import { jsonError } from "@/server/auth/guard";
import type { CommandFailureReason, CommandResult } from "./commands";
import type { DesignDetailDto } from "./queries";
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

export function commandResponse<T>(result: CommandResult<T>, successStatus = 200): Response {
  if (result.ok) return Response.json(result.data, { status: successStatus, headers: NO_STORE });
  const response = jsonError(STATUS[result.reason], result.message, result.fieldErrors);
  if (!result.conflict) return response;
  return Response.json(
    { error: { message: result.message, conflict: true } },
    { status: 409, headers: NO_STORE },
  );
}

/** What GET /api/v1/designs/[id] returns: the design with its working revision. */
export function toApiDesign(design: DesignDetailDto) {
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
      coreVersion: design.coreVersion,
      lastEditedByName: design.lastEditedByName,
      updatedAt: design.revisionUpdatedAt,
    },
  };
}
