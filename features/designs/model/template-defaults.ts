// Shared defaults for the design templates: the parts of a JointDesign a designer rarely sets on
// the first screen (gasket material, washer, preload rule, loads). Every value here is a starting
// point shown in the editor, not a recommendation; the tags follow the catalogue convention.
import type { Fastener, GasketMaterial, JointDesign, ThreadSeries } from "@/features/analysis/core/design";
import { createDefaultEstimatorSettings } from "@/features/analysis/core/design";
import { getGasketTypeById } from "@/features/analysis/core/catalogue/gaskets";
import { findThread } from "@/features/analysis/core/catalogue/threads";

export const STEEL_MODULUS_MPA = 200_000;
export const DEFAULT_GASKET_TYPE_ID = "compressed-fibre-1-8";
export const DEFAULT_PIPE_GASKET_TYPE_ID = "compressed-fibre-1-16";
/** A soft sheet for full-face joints (elastomer with fabric insertion, ASME VIII-1 Table 2-5.1) [practice]. */
export const FULL_FACE_GASKET_TYPE_ID = "elastomer-cotton-insertion";

/** Metric sizes offered for covers and custom flanges (all in catalogue/threads.ts). */
export const METRIC_BOLT_SIZES = ["M12", "M16", "M20", "M24", "M27", "M30", "M36"] as const;
export type MetricBoltSize = (typeof METRIC_BOLT_SIZES)[number];

export function gasketMaterialFromCatalogue(typeId: string): GasketMaterial {
  const row = getGasketTypeById(typeId);
  if (!row) throw new Error(`gasket type ${typeId} is not in the catalogue`);
  return {
    name: row.name,
    catalogueId: row.id,
    m: row.m,
    yMpa: row.yMpa,
    modulusMpa: row.typicalModulusMpa,
    thicknessMm: row.typicalThicknessMm,
    source: `${row.source}; ${row.edition}`,
  };
}

export function threadSeriesFor(designation: string): ThreadSeries {
  if (designation.startsWith("M")) return "metric-coarse";
  return findThread(designation, "unc") ? "unc" : "unified-8un";
}

export function nominalDiameterMm(designation: string): number {
  const thread = findThread(designation, threadSeriesFor(designation));
  if (!thread) throw new Error(`thread ${designation} is not in the catalogue`);
  return thread.nominalDiameterMm;
}

/** Clearance hole: ISO 273 medium series is about d + 2 mm up to M24 and d + 3 mm above [practice]. */
export function metricHoleDiameterMm(dMm: number): number {
  return dMm + (dMm <= 24 ? 2 : 3);
}

/**
 * A fastener whose length covers the clamped stack, two nut heights (≈ 0.8·d each, ISO 4032)
 * and three thread pitches of protrusion [practice], rounded up to 5 mm.
 */
export function buildFastener(options: {
  designation: string;
  materialId: string;
  holeDiameterMm: number;
  clampedMm: number;
  withWasher: boolean;
}): Fastener {
  const series = threadSeriesFor(options.designation);
  const thread = findThread(options.designation, series);
  if (!thread) throw new Error(`thread ${options.designation} is not in the catalogue`);
  const d = thread.nominalDiameterMm;
  // Washer proportions of ISO 7089 (OD ≈ 1.85·d, t ≈ 0.15·d), rounded [practice].
  const washer = options.withWasher
    ? {
        thicknessMm: Math.max(1, Math.round(0.15 * d * 2) / 2),
        outerDiameterMm: Math.max(Math.round(1.85 * d), Math.ceil(options.holeDiameterMm) + 4),
      }
    : null;
  const stack = options.clampedMm + 2 * (washer?.thicknessMm ?? 0) + 2 * 0.8 * d + 3 * thread.pitchMm;
  return {
    designation: options.designation,
    threadSeries: series,
    materialId: options.materialId,
    form: "stud",
    lengthMm: Math.ceil(stack / 5) * 5,
    holeDiameterMm: options.holeDiameterMm,
    washer,
    ...(series === "metric-coarse" ? { nutSeries: "iso-4032" as const } : {}),
    termination: { kind: "nut" },
  };
}

/** Loads, assembly and estimator settings every template starts with. */
export function defaultJointSettings(): Pick<JointDesign, "loads" | "assembly" | "estimator"> {
  return {
    loads: { designPressureMpa: 1, designTemperatureC: 20, axialLoadN: 0, momentNmm: 0 },
    assembly: {
      // Half of yield is a common first target for torqued flange bolting [practice].
      preload: { kind: "fraction-of-yield", value: 0.5 },
      nutFactor: { value: 0.2, source: "typical value for lubricated steel threads [practice]" },
      method: "torque-wrench",
      scatterOverride: null,
    },
    estimator: createDefaultEstimatorSettings(),
  };
}
