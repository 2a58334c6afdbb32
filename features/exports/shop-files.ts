import type { JointDesign } from "@/features/analysis/core/design";
import { buildBoltRows } from "./model/bolt-rows";
import { buildDrillingTemplateDxf } from "./model/drilling-template";
import { buildHoleListCsv } from "./model/hole-list";
import { listUnverifiedValues } from "@/features/analysis/unverified-values";

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
