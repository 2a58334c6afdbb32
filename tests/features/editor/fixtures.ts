import type { JointDesign } from "@/features/analysis/core/design";
import { createDefaultEstimatorSettings } from "@/features/analysis/core/design";

/** A 600 × 400 mm rectangular cover with a full-face gasket and 12 M20 bolts on a 40 mm offset path. */
export function makeCover(): JointDesign {
  return {
    schemaVersion: 1,
    name: "E-2107 channel cover (editor test)",
    units: "SI",
    outline: { kind: "rectangle", widthMm: 600, heightMm: 400, cornerRadiusMm: 40 },
    bore: { kind: "rectangle", widthMm: 440, heightMm: 240, cornerRadiusMm: 20 },
    gasket: {
      kind: "full-face",
      material: {
        name: "Compressed fibre 1/8 in",
        catalogueId: "compressed-fibre-1-8",
        m: 2,
        yMpa: 11.03,
        modulusMpa: 1000,
        thicknessMm: 3.2,
        source: "ASME BPVC VIII-1 Table 2-5.1",
      },
    },
    boltPath: { kind: "offset", offsetMm: 40 },
    bolts: Array.from({ length: 12 }, (_, i) => ({ id: `b${i + 1}`, sMm: (i + 0.5) * 120 })),
    fastener: {
      designation: "M20",
      threadSeries: "metric-coarse",
      materialId: "iso-898-1-8.8",
      form: "stud",
      lengthMm: 120,
      holeDiameterMm: 22,
      washer: null,
      termination: { kind: "nut" },
    },
    layers: [
      { role: "cover", thicknessMm: 30, materialName: "Carbon steel", modulusMpa: 200_000 },
      { role: "gasket" },
      { role: "flange", thicknessMm: 30, materialName: "Carbon steel", modulusMpa: 200_000 },
    ],
    loads: { designPressureMpa: 1, designTemperatureC: 120, axialLoadN: 0, momentNmm: 0 },
    assembly: {
      preload: { kind: "fraction-of-proof", value: 0.7 },
      nutFactor: { value: 0.2, source: "lubricated steel, typical" },
      method: "torque-wrench",
      scatterOverride: null,
    },
    estimator: createDefaultEstimatorSettings(),
  };
}

export function makeCircle(count = 8): JointDesign {
  const d = makeCover();
  return {
    ...d,
    outline: { kind: "circle", diameterMm: 400 },
    bore: { kind: "circle", diameterMm: 200 },
    boltPath: { kind: "circle", diameterMm: 340 },
    bolts: Array.from({ length: count }, (_, i) => ({
      id: `b${i + 1}`,
      sMm: ((i + 0.5) * Math.PI * 340) / count,
    })),
  };
}
