/**
 * A standard flange used within its pressure–temperature rating (ASME VIII-1 UG-44(a): flanges to
 * ASME B16.5 are accepted at their rating) gets the status "accepted-by-rating" on the rules that
 * are meant for flanges designed by rule (the maximum-pitch rule). The design must still be the
 * catalogue flange: same OD, bolt circle, bolt count and bolt size as its template row.
 */
import type { JointDesign } from "../design";
import { getFlangeTemplateById } from "../catalogue/flange-templates";
import {
  B165_GROUP_OF_MATERIAL,
  getRatingTable,
  ratedPressureBar,
  type RatingTable,
} from "../catalogue/pt-ratings";
import { makeCheck, type CheckRecord } from "../checks/check-record";

export interface StandardRating {
  templateId: string;
  label: string;
  table: RatingTable | null;
  ratedMpa: number | null;
  withinRating: boolean;
  reason: string;
}

const UG44 = "ASME VIII-1 UG-44(a) [mem]";

/** Null when the design was not started from a standard flange template. */
export function standardFlangeRating(design: JointDesign): StandardRating | null {
  const row = design.templateId ? getFlangeTemplateById(design.templateId) : undefined;
  if (!row) return null;
  const label = `${row.standard} Class ${row.pressureClass} NPS ${row.nps}`;
  const base = { templateId: row.id, label, table: null, ratedMpa: null, withinRating: false };
  const near = (a: number, b: number) => Math.abs(a - b) <= 0.5;
  const same =
    design.outline.kind === "circle" &&
    near(design.outline.diameterMm, row.outsideDiameterMm) &&
    design.boltPath.kind === "circle" &&
    near(design.boltPath.diameterMm, row.boltCircleDiameterMm) &&
    design.bolts.length === row.boltCount &&
    design.fastener.designation === row.boltDesignation;
  if (!same)
    return {
      ...base,
      reason: `No longer the ${label} of its template (OD, bolt circle, bolt count or bolt size changed): designed by rule.`,
    };
  const matId = design.flangeDesign?.flangeMaterialId ?? null;
  const group = (matId && B165_GROUP_OF_MATERIAL[matId]) || row.materialGroup;
  const table = getRatingTable("ASME B16.5", `Class ${row.pressureClass}`, group) ?? null;
  if (!table)
    return {
      ...base,
      reason: `No ${row.standard} Class ${row.pressureClass} rating for material group ${group} in the catalogue.`,
    };
  const T = design.loads.designTemperatureC;
  const bar = ratedPressureBar(table, T);
  if (bar === null)
    return {
      ...base,
      table,
      reason: `${T} °C is above the last temperature of ${table.source} in the catalogue.`,
    };
  const ratedMpa = bar / 10;
  const within = design.loads.designPressureMpa <= ratedMpa;
  return {
    ...base,
    table,
    ratedMpa,
    withinRating: within,
    reason: within
      ? `${label}, material group ${group}: ${(design.loads.designPressureMpa * 10).toFixed(2)} bar at ${T} °C is within its rating of ${bar.toFixed(1)} bar (${table.source}, ${table.edition} [${table.confidence}]); accepted by its rating (${UG44}).`
      : `${label}, material group ${group}: ${(design.loads.designPressureMpa * 10).toFixed(2)} bar at ${T} °C exceeds its rating of ${bar.toFixed(1)} bar (${table.source} [${table.confidence}]).`,
  };
}

/** The rating check of a standard flange (none for a custom flange). */
export function ratingChecks(rating: StandardRating | null, designPressureMpa: number): CheckRecord[] {
  if (!rating) return [];
  return [
    makeCheck({
      id: "flange.rating",
      title: "Standard flange within its pressure–temperature rating",
      value: designPressureMpa,
      limit: rating.ratedMpa,
      unit: "MPa",
      status: rating.ratedMpa === null ? "not-applicable" : rating.withinRating ? "pass" : "fail",
      source: rating.table
        ? `${rating.table.source}, ${rating.table.edition} [${rating.table.confidence}]; ${UG44}`
        : UG44,
      note: rating.reason,
    }),
  ];
}
