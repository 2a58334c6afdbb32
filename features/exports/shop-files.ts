import type { JointDesign } from "@/features/analysis/core/design";
import { listUnverifiedValues } from "@/features/analysis/unverified-values";
import { buildBoltRows } from "./model/bolt-rows";
import { buildBoltingKit, buildBoltingKitCsv } from "./model/bolting-kit";
import { buildDrillingTemplateDxf } from "./model/drilling-template";
import type { DrillingTitle } from "./model/drilling-notes";
import { buildHoleListCsv } from "./model/hole-list";
import { buildPassLog, buildPassLogCsv } from "./model/pass-log";

type StoredBolts = {
  bolts?: { id: string; xMm: number; yMm: number }[];
  assemblyPlan?: { sequence?: string[] };
} | null;

function rowsFor(document: JointDesign, result: unknown) {
  const r = (result ?? null) as StoredBolts;
  const points = r?.bolts ? new Map(r.bolts.map((b) => [b.id, { xMm: b.xMm, yMm: b.yMm }])) : undefined;
  return buildBoltRows(document, r?.assemblyPlan?.sequence ?? [], points);
}

/** The hole list of a stored revision (positions as stored in its result, order from its plan). */
export function holeListFor(document: JointDesign, result: unknown): string {
  return buildHoleListCsv(document, rowsFor(document, result), {
    unverified: listUnverifiedValues(document, result).length > 0,
  });
}

/** The facts of a stored revision the drilling template's title block names (ExportRevisionDto has them). */
export interface ShopRevisionFacts {
  designName: string;
  equipmentTag: string;
  number: number;
  status: DrillingTitle["status"];
  approvedAt: string | null;
  approverName: string | null;
}

/** The drilling template of a stored revision, with hole callouts and a title block. */
export function drillingTemplateFor(
  document: JointDesign,
  result: unknown,
  revision: ShopRevisionFacts,
  exportedAt: Date = new Date(),
): string {
  return buildDrillingTemplateDxf(document, rowsFor(document, result), {
    designName: revision.designName,
    equipmentTag: revision.equipmentTag,
    revisionNumber: revision.number,
    status: revision.status,
    approvedAt: revision.status === "approved" ? revision.approvedAt : null,
    approver: revision.status === "approved" ? revision.approverName : null,
    exportedAt: exportedAt.toISOString(),
    unverified: listUnverifiedValues(document, result).length > 0,
  });
}

/** The Bolting kit of a stored revision as CSV (the sheet prints the same lines). */
export function boltingKitFor(document: JointDesign, result: unknown): string {
  return buildBoltingKitCsv(document, buildBoltingKit(document), {
    unverified: listUnverifiedValues(document, result).length > 0,
  });
}

/** The Pass log of a stored revision as CSV (the sheet's Pass log pages hold the same targets). */
export function passLogFor(document: JointDesign, result: unknown): string {
  return buildPassLogCsv(document, buildPassLog(document, result, rowsFor(document, result)), {
    unverified: listUnverifiedValues(document, result).length > 0,
  });
}
