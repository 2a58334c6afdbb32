import "server-only";
import type { Kysely } from "kysely";
import type { Database } from "@/db/types";
import type { UnitSystem } from "@/features/analysis/core/design";
import { findExportRevision, type ExportRevisionDto } from "@/features/exports/queries";
import { listJustifications } from "@/features/reviews/queries";
import { describeIntegrity, verifySnapshot } from "@/features/analysis/content-hash";
import { feCheckForSheet } from "@/features/fe-check/store";
import type { SheetInput, SheetPaper } from "./sheet-input";

/**
 * Everything the sheet of one stored revision needs, read for the viewer's organisation (the
 * export routes and the background worker share this). Undefined when the revision is not this
 * organisation's. Frozen snapshots are re-hashed, and the sheet says whether the hash holds.
 */
export async function loadSheetInput(
  db: Kysely<Database>,
  organizationId: string,
  designId: string,
  number: number,
  options: { paper: SheetPaper; units: UnitSystem; createdAt: Date },
): Promise<{ revision: ExportRevisionDto; input: SheetInput } | undefined> {
  const revision = await findExportRevision(db, organizationId, designId, number);
  if (!revision) return undefined;
  const justifications = await listJustifications(db, organizationId, revision.revisionId);
  const fe = await feCheckForSheet(db, organizationId, revision.revisionId);
  const frozen = revision.status === "in_review" || revision.status === "approved";
  const integrity = frozen
    ? verifySnapshot({
        document: revision.document,
        result: revision.result,
        coreVersion: revision.coreVersion,
        contentHash: revision.contentHash,
      })
    : ({ state: "not-frozen" } as const);
  return {
    revision,
    input: {
      design: { name: revision.designName, equipmentTag: revision.equipmentTag },
      revision: {
        number: revision.number,
        status: revision.status,
        designer: revision.designerName,
        approver: revision.approverName,
        approvedAt: revision.approvedAt,
        contentHash: revision.contentHash,
        integrityNote: describeIntegrity(integrity),
      },
      document: revision.document,
      result: revision.result,
      justifications: justifications.map((j) => ({
        checkId: j.checkId,
        status: j.checkStatus,
        text: j.text,
        by: j.authorName,
        at: j.at,
      })),
      feCheck:
        fe && fe.dto.result && fe.dto.resultHash && fe.dto.finishedAt
          ? {
              result: fe.dto.result,
              resultHash: fe.dto.resultHash,
              finishedAt: fe.dto.finishedAt,
              cited: fe.cited,
            }
          : null,
      paper: options.paper,
      units: options.units,
      createdAt: options.createdAt,
    },
  };
}
