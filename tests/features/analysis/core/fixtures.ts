/**
 * Design builders for the core tests and the benchmark: parametric versions of the joint kinds
 * the product handles. The numbers are plausible example values of our own, not taken from a
 * standard unless a test says so.
 */
import type { GasketMaterial, JointDesign } from "@/features/analysis/core/design";
import { placeBoltsEqually } from "@/features/analysis/core/geometry";
import { psiToMpa } from "@/features/analysis/core/units";

export const SPIRAL_WOUND: GasketMaterial = {
  name: "Spiral-wound metal, stainless, fibre filled",
  catalogueId: "spiral-wound-ss-fibre",
  m: 3,
  yMpa: psiToMpa(10000),
  modulusMpa: 1000,
  thicknessMm: 3.3,
  source: "ASME VIII-1 Table 2-5.1 (m, y); modulus typical [mem]",
};

export const ELASTOMER_INSERTION: GasketMaterial = {
  name: "Elastomer with cotton insertion",
  catalogueId: "elastomer-cotton-insertion",
  m: 1.25,
  yMpa: psiToMpa(400),
  modulusMpa: 50,
  thicknessMm: 3,
  source: "ASME VIII-1 Table 2-5.1 (m, y); modulus typical [mem]",
};

export interface CircularOptions {
  boltCount?: number;
  outsideDiameterMm?: number;
  boltCircleMm?: number;
  boreMm?: number | null;
  gasket?: { innerDiameterMm: number; outerDiameterMm: number } | "full-face";
  gasketMaterial?: GasketMaterial;
  designation?: string;
  threadSeries?: JointDesign["fastener"]["threadSeries"];
  holeDiameterMm?: number;
  flangeThicknessMm?: number;
  flangeModulusMpa?: number;
  pressureMpa?: number;
  estimator?: JointDesign["estimator"]["estimator"];
  coneAngle?: JointDesign["estimator"]["coneAngle"];
  samplesPerPitch?: number;
  units?: JointDesign["units"];
}

/** Circular flange pair with a ring (default) or full-face gasket, bolts straddling the centre lines. */
export function circularFlange(o: CircularOptions = {}): JointDesign {
  const n = o.boltCount ?? 8;
  const bc = o.boltCircleMm ?? 241.3;
  const od = o.outsideDiameterMm ?? bc + 38.1;
  const t = o.flangeThicknessMm ?? 25.4;
  const mat = o.gasketMaterial ?? SPIRAL_WOUND;
  const gasket: JointDesign["gasket"] =
    o.gasket === "full-face"
      ? { kind: "full-face", material: mat }
      : {
          kind: "ring",
          geometry: { kind: "annulus", ...(o.gasket ?? { innerDiameterMm: 182.6, outerDiameterMm: 209.6 }) },
          material: mat,
        };
  return {
    schemaVersion: 1,
    name: `test circular flange, ${n} bolts`,
    units: o.units ?? "SI",
    outline: { kind: "circle", diameterMm: od },
    bore: o.boreMm === null ? null : { kind: "circle", diameterMm: o.boreMm ?? 154.1 },
    gasket,
    boltPath: { kind: "circle", diameterMm: bc },
    bolts: placeBoltsEqually(Math.PI * bc, n),
    fastener: {
      designation: o.designation ?? "3/4",
      threadSeries: o.threadSeries ?? "unc",
      materialId: "astm-a193-b7",
      form: "stud",
      lengthMm: 2 * t + mat.thicknessMm + 50,
      holeDiameterMm: o.holeDiameterMm ?? 22.2,
      washer: null,
      termination: { kind: "nut" },
    },
    layers: [
      {
        role: "flange",
        thicknessMm: t,
        materialName: "carbon steel",
        modulusMpa: o.flangeModulusMpa ?? 202000,
      },
      { role: "gasket" },
      {
        role: "flange",
        thicknessMm: t,
        materialName: "carbon steel",
        modulusMpa: o.flangeModulusMpa ?? 202000,
      },
    ],
    loads: { designPressureMpa: o.pressureMpa ?? 1, designTemperatureC: 40, axialLoadN: 0, momentNmm: 0 },
    assembly: {
      preload: { kind: "bolt-stress", value: psiToMpa(50000), areaBasis: "root" },
      nutFactor: { value: 0.2, source: "test value" },
      method: "torque-wrench",
      scatterOverride: null,
    },
    estimator: {
      coneAngle: o.coneAngle ?? { mode: "thickness-dependent" },
      estimator: o.estimator ?? "auto",
      samplesPerPitch: o.samplesPerPitch ?? 64,
      grid: { nx: 64, ny: 64 },
    },
  };
}

/** A 96-bolt heat-exchanger girth flange (M30 on a 2500 mm bolt circle, ring gasket inside). */
export function girthFlange96(): JointDesign {
  return circularFlange({
    boltCount: 96,
    outsideDiameterMm: 2620,
    boltCircleMm: 2500,
    boreMm: 2300,
    gasket: { innerDiameterMm: 2360, outerDiameterMm: 2420 },
    designation: "M30",
    threadSeries: "metric-coarse",
    holeDiameterMm: 33,
    flangeThicknessMm: 90,
  });
}

export interface RectOptions {
  boltCount?: number;
  widthMm?: number;
  heightMm?: number;
  cornerRadiusMm?: number;
  boltOffsetMm?: number;
  coverThicknessMm?: number;
  gasketMaterial?: GasketMaterial;
  estimator?: JointDesign["estimator"]["estimator"];
  coneAngle?: JointDesign["estimator"]["coneAngle"];
  boltCountOverride?: JointDesign["bolts"];
}

/** Rectangular cover on a frame with a full-face gasket, M16 bolts on an inward offset of the outline. */
export function rectangularCover(o: RectOptions = {}): JointDesign {
  const w = o.widthMm ?? 600,
    h = o.heightMm ?? 400,
    r = o.cornerRadiusMm ?? 30,
    off = o.boltOffsetMm ?? 25;
  const n = o.boltCount ?? 20;
  const rr = Math.max(r - off, 0);
  const L = 2 * (w - 2 * off) + 2 * (h - 2 * off) - (8 - 2 * Math.PI) * rr;
  return {
    schemaVersion: 1,
    name: `test rectangular cover, ${n} bolts`,
    units: "SI",
    outline: { kind: "rectangle", widthMm: w, heightMm: h, cornerRadiusMm: r },
    bore: { kind: "rectangle", widthMm: w - 120, heightMm: h - 120, cornerRadiusMm: 20 },
    gasket: { kind: "full-face", material: o.gasketMaterial ?? ELASTOMER_INSERTION },
    boltPath: { kind: "offset", offsetMm: off },
    bolts: o.boltCountOverride ?? placeBoltsEqually(L, n),
    fastener: {
      designation: "M16",
      threadSeries: "metric-coarse",
      materialId: "iso-898-1-8.8",
      form: "hex-bolt",
      lengthMm: 80,
      holeDiameterMm: 18,
      washer: { thicknessMm: 3, outerDiameterMm: 30 },
      termination: { kind: "nut" },
    },
    layers: [
      {
        role: "cover",
        thicknessMm: o.coverThicknessMm ?? 20,
        materialName: "steel plate",
        modulusMpa: 210000,
      },
      { role: "gasket" },
      { role: "flange", thicknessMm: 25, materialName: "steel frame", modulusMpa: 210000 },
    ],
    loads: { designPressureMpa: 0.3, designTemperatureC: 40, axialLoadN: 0, momentNmm: 0 },
    assembly: {
      preload: { kind: "fraction-of-proof", value: 0.5 },
      nutFactor: { value: 0.18, source: "test value" },
      method: "torque-wrench",
      scatterOverride: null,
    },
    estimator: {
      coneAngle: o.coneAngle ?? { mode: "thickness-dependent" },
      estimator: o.estimator ?? "auto",
      samplesPerPitch: 64,
      grid: { nx: 64, ny: 64 },
    },
  };
}
