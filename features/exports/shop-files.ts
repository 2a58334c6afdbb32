import type { JointDesign } from "@/features/analysis/core/design";
import { listUnverifiedValues } from "@/features/analysis/unverified-values";
import { buildBoltRows } from "./model/bolt-rows";
import { buildBoltingKit, buildBoltingKitCsv } from "./model/bolting-kit";
import { buildDrillingTemplateDxf } from "./model/drilling-template";
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

/** The drilling template of a stored revision. */
export function drillingTemplateFor(document: JointDesign, result: unknown): string {
  return buildDrillingTemplateDxf(document, rowsFor(document, result), {
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
