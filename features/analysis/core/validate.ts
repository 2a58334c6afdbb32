/**
 * Validity checks of a design document that need geometry or catalogue knowledge. Pure: returns
 * a list of issues, each naming the field path the way an editor would show it
 * (`bolts[3].position: bolt hole lies outside the flange outline`). The zod schema calls this
 * from a refinement; `analyzeJoint` refuses a design with issues.
 */
import type { JointDesign, Outline, PointMm, StockedBoltMaterial } from "./design";
import { MAX_BOLT_COUNT } from "./design";
import { INPUT_BOUNDS, WORK_LIMITS, boundMessage, withinBound, type InputBound } from "./bounds";
import { getBoltPath, getBoltPoint, outlineToPolyline } from "./geometry";
import { pathToPolyline } from "./path";
import { buildPointHash, forEachNear } from "./point-hash";
import { outlineToShape, signedDistanceToShape, type Shape } from "./shape";
import { findThread } from "./catalogue/threads";
import { boltMaterialOf } from "./catalogue/bolt-materials";
import { validateFlangeInputs } from "./flange-design/validate-flange-inputs";
import * as fm from "./fixed-math";

export interface DesignIssue {
  /** Field path, e.g. "bolts[3].position" or "gasket.geometry.outerDiameterMm". */
  path: string;
  message: string;
}

/** Formats an issue as one line: `path: message`. */
export function formatIssue(issue: DesignIssue): string {
  return `${issue.path}: ${issue.message}`;
}

/**
 * What the core throws instead of returning numbers: a design its validator rejects ("invalid
 * design: …"), or results that fail their own force balance ("results refused: …").
 */
export class DesignRefusedError extends Error {
  override name = "DesignRefusedError";
  constructor(
    readonly issues: DesignIssue[],
    prefix = "invalid design",
  ) {
    super(`${prefix}: ${issues.map(formatIssue).join("; ")}`);
  }
}

/** Most strength ranges one bolting material may hold (the Stockroom's rows hold a few). */
export const MAX_STOCKED_RANGES = 20;

/**
 * A Stockroom bolting row copied into a design (or offered to the pattern search): every number
 * finite and positive, at least one range, tensile not below yield. `at` prefixes the paths.
 */
export function validateStockedMaterial(
  m: StockedBoltMaterial,
  at = "fastener.stockedMaterial",
): DesignIssue[] {
  const issues: DesignIssue[] = [];
  const positive = (path: string, v: number | null) => {
    if (v !== null && !(Number.isFinite(v) && v > 0))
      issues.push({ path: `${at}.${path}`, message: "must be greater than 0" });
  };
  positive("modulusMpa", m.modulusMpa);
  if (m.ranges.length === 0 || m.ranges.length > MAX_STOCKED_RANGES)
    issues.push({ path: `${at}.ranges`, message: `give from 1 to ${MAX_STOCKED_RANGES} strength ranges` });
  m.ranges.forEach((r, i) => {
    positive(`ranges[${i}].maxDiameterMm`, r.maxDiameterMm);
    positive(`ranges[${i}].proofMpa`, r.proofMpa);
    positive(`ranges[${i}].yieldMpa`, r.yieldMpa);
    positive(`ranges[${i}].tensileMpa`, r.tensileMpa);
    positive(`ranges[${i}].allowableMpa`, r.allowableMpa);
    if (r.tensileMpa < r.yieldMpa)
      issues.push({ path: `${at}.ranges[${i}].tensileMpa`, message: "must not be below the yield strength" });
  });
  return issues;
}

function outlineNumbers(o: Outline): [string, number, InputBound][] {
  const plan = INPUT_BOUNDS.planDimensionMm;
  switch (o.kind) {
    case "circle":
      return [["diameterMm", o.diameterMm, plan]];
    case "rectangle":
      return [
        ["widthMm", o.widthMm, plan],
        ["heightMm", o.heightMm, plan],
        ["cornerRadiusMm", o.cornerRadiusMm, INPUT_BOUNDS.cornerRadiusMm],
      ];
    case "obround":
      return [
        ["lengthMm", o.lengthMm, plan],
        ["widthMm", o.widthMm, plan],
      ];
    case "polygon":
      return o.points.flatMap((p, i): [string, number, InputBound][] => [
        [`points[${i}].x`, p.x, INPUT_BOUNDS.planCoordinateMm],
        [`points[${i}].y`, p.y, INPUT_BOUNDS.planCoordinateMm],
      ]);
  }
}

function boundaryPoints(o: Outline): PointMm[] {
  return outlineToPolyline(o, Math.max(1, 1e-3 * approxSize(o)));
}

function approxSize(o: Outline): number {
  switch (o.kind) {
    case "circle":
      return o.diameterMm;
    case "rectangle":
      return Math.max(o.widthMm, o.heightMm);
    case "obround":
      return Math.max(o.lengthMm, o.widthMm);
    case "polygon":
      return 1000;
  }
}

function maxSdf(shape: Shape, pts: PointMm[]): number {
  let m = -Infinity;
  for (const p of pts) m = Math.max(m, signedDistanceToShape(shape, p.x, p.y));
  return m;
}

/** Returns every problem found; an empty list means the core can analyse the design. */
export function validateJointDesign(design: JointDesign): DesignIssue[] {
  const issues: DesignIssue[] = [];
  const add = (path: string, message: string) => issues.push({ path, message });
  // Every physical input within its plausible range (core/bounds.ts), the range and reason in the message.
  const inRange = (path: string, v: number | undefined, bound: InputBound) => {
    if (v === undefined) return;
    if (!Number.isFinite(v)) add(path, "must be a finite number");
    else if (!withinBound(bound, v)) add(path, boundMessage(bound));
  };
  const B = INPUT_BOUNDS;

  if (design.schemaVersion !== 1) add("schemaVersion", "unsupported schema version (expected 1)");
  for (const [k, v, bound] of outlineNumbers(design.outline)) inRange(`outline.${k}`, v, bound);
  if (design.outline.kind === "polygon" && design.outline.points.length < 3)
    add("outline.points", "a polygon needs at least 3 points");
  if (design.bore) for (const [k, v, bound] of outlineNumbers(design.bore)) inRange(`bore.${k}`, v, bound);
  if (design.boltPath.kind === "circle")
    inRange("boltPath.diameterMm", design.boltPath.diameterMm, B.planDimensionMm);
  else inRange("boltPath.offsetMm", design.boltPath.offsetMm, B.planDimensionMm);
  const f = design.fastener;
  inRange("fastener.lengthMm", f.lengthMm, B.boltLengthMm);
  inRange("fastener.holeDiameterMm", f.holeDiameterMm, B.holeDiameterMm);
  if (f.washer) {
    inRange("fastener.washer.thicknessMm", f.washer.thicknessMm, B.washerThicknessMm);
    inRange("fastener.washer.outerDiameterMm", f.washer.outerDiameterMm, B.washerOuterDiameterMm);
  }
  if (f.termination.kind === "tapped-hole") {
    inRange("fastener.termination.engagementMm", f.termination.engagementMm, B.engagementMm);
    inRange(
      "fastener.termination.memberThicknessMm",
      f.termination.memberThicknessMm,
      B.tappedMemberThicknessMm,
    );
    inRange("fastener.termination.memberModulusMpa", f.termination.memberModulusMpa, B.plateModulusMpa);
  }
  const gm = design.gasket.material;
  inRange("gasket.material.modulusMpa", gm.modulusMpa, B.gasketModulusMpa);
  inRange("gasket.material.thicknessMm", gm.thicknessMm, B.gasketThicknessMm);
  inRange("gasket.material.m", gm.m, B.gasketFactorM);
  inRange("gasket.material.yMpa", gm.yMpa, B.gasketStressMpa);
  inRange("gasket.material.qMinMpa", gm.qMinMpa, B.gasketStressMpa);
  inRange("gasket.material.qsMinMpa", gm.qsMinMpa, B.gasketStressMpa);
  inRange("gasket.material.qsMaxMpa", gm.qsMaxMpa, B.gasketCrushMpa);
  const g0 = design.gasket;
  if (g0.kind === "ring" && g0.geometry.kind === "annulus") {
    inRange("gasket.geometry.innerDiameterMm", g0.geometry.innerDiameterMm, B.planDimensionMm);
    inRange("gasket.geometry.outerDiameterMm", g0.geometry.outerDiameterMm, B.planDimensionMm);
  } else if (g0.kind === "ring" && g0.geometry.kind === "band") {
    inRange("gasket.geometry.centreOffsetMm", g0.geometry.centreOffsetMm, B.planDimensionMm);
    inRange("gasket.geometry.widthMm", g0.geometry.widthMm, B.planDimensionMm);
  }
  design.layers.forEach((l, i) => {
    if (l.role !== "gasket") {
      inRange(`layers[${i}].thicknessMm`, l.thicknessMm, B.plateThicknessMm);
      inRange(`layers[${i}].modulusMpa`, l.modulusMpa, B.plateModulusMpa);
    }
  });
  const gasketLayers = design.layers.filter((l) => l.role === "gasket").length;
  if (gasketLayers !== 1) add("layers", `exactly one layer must be the gasket (found ${gasketLayers})`);
  if (design.layers.length - gasketLayers < 1) add("layers", "at least one flange or cover layer is needed");
  const loads = design.loads;
  inRange("loads.designPressureMpa", loads.designPressureMpa, B.designPressureMpa);
  inRange("loads.designTemperatureC", loads.designTemperatureC, B.designTemperatureC);
  inRange("loads.axialLoadN", loads.axialLoadN, B.axialLoadN);
  inRange("loads.momentNmm", loads.momentNmm, B.momentNmm);
  inRange("assembly.nutFactor.value", design.assembly.nutFactor.value, B.nutFactor);
  const preload = design.assembly.preload;
  inRange(
    "assembly.preload.value",
    preload.value,
    preload.kind === "bolt-stress" ? B.preloadStressMpa : B.preloadFraction,
  );
  const so = design.assembly.scatterOverride;
  if (so !== null) inRange("assembly.scatterOverride", so, B.scatter);
  const est = design.estimator;
  inRange("estimator.samplesPerPitch", est.samplesPerPitch, B.samplesPerPitch);
  if (est.coneAngle.mode === "fixed")
    inRange("estimator.coneAngle.degrees", est.coneAngle.degrees, B.coneAngleDeg);
  for (const k of ["nx", "ny"] as const) inRange(`estimator.grid.${k}`, est.grid[k], B.gridCells);
  const n = design.bolts.length;
  if (n < 1 || n > MAX_BOLT_COUNT)
    add("bolts", `bolt count must be between 1 and ${MAX_BOLT_COUNT} (got ${n})`);
  // The work of one analysis is capped (core/bounds.ts WORK_LIMITS).
  const samples = n * est.samplesPerPitch;
  if (samples > WORK_LIMITS.pathSamples.max)
    add(
      "estimator.samplesPerPitch",
      `${n} bolts × ${est.samplesPerPitch} samples per pitch = ${samples} gasket-path samples, over the work limit of ${WORK_LIMITS.pathSamples.max} (${WORK_LIMITS.pathSamples.why}); lower the samples per pitch`,
    );
  const cells = est.grid.nx * est.grid.ny;
  if (cells > WORK_LIMITS.gridCells.max)
    add(
      "estimator.grid",
      `${est.grid.nx} × ${est.grid.ny} = ${cells} heat-map cells, over the work limit of ${WORK_LIMITS.gridCells.max} (${WORK_LIMITS.gridCells.why})`,
    );
  const thread = findThread(f.designation, f.threadSeries);
  if (!thread)
    add("fastener.designation", `no ${f.threadSeries} thread "${f.designation}" in the thread catalogue`);
  if (f.stockedMaterial) issues.push(...validateStockedMaterial(f.stockedMaterial));
  else if (!boltMaterialOf(f)) add("fastener.materialId", `unknown bolt material "${f.materialId}"`);
  if (thread && f.holeDiameterMm < thread.nominalDiameterMm)
    add("fastener.holeDiameterMm", "bolt hole is smaller than the bolt");
  if (f.washerActsAs !== undefined && f.washerActsAs !== "rigid" && f.washerActsAs !== "flexible")
    add("fastener.washerActsAs", 'must be "rigid" or "flexible"');
  if (f.washer && f.washer.outerDiameterMm <= f.holeDiameterMm)
    add("fastener.washer.outerDiameterMm", "washer must be larger than the bolt hole");
  issues.push(...validateFlangeInputs(design));
  if (issues.length > 0) return issues; // geometry below needs sane numbers

  design.bolts.forEach((b, i) => {
    if (!Number.isFinite(b.sMm)) add(`bolts[${i}].sMm`, "must be a finite number");
    if (b.offPathMm !== undefined && !Number.isFinite(b.offPathMm))
      add(`bolts[${i}].offPathMm`, "must be a finite number");
  });
  const seen = new Map<string, number>();
  design.bolts.forEach((b, i) => {
    if (seen.has(b.id)) add(`bolts[${i}].id`, `duplicate bolt id "${b.id}" (also bolts[${seen.get(b.id)}])`);
    else seen.set(b.id, i);
  });
  if (issues.length > 0) return issues;

  const outline = outlineToShape(design.outline);
  const bore = design.bore ? outlineToShape(design.bore) : null;
  if (bore && design.bore && maxSdf(outline, boundaryPoints(design.bore)) >= 0)
    add("bore", "bore does not lie inside the flange outline");
  const boltPath = getBoltPath(design.outline, design.boltPath);
  if (
    boltPath.lengthMm <= 0 ||
    maxSdf(outline, pathToPolyline(boltPath, Math.max(1, boltPath.lengthMm / 2000))) >= 0
  ) {
    add("boltPath", "bolt path does not lie inside the flange outline");
  }
  const rh = f.holeDiameterMm / 2;
  const pts = design.bolts.map((b) => getBoltPoint(boltPath, b));
  pts.forEach((p, i) => {
    if (signedDistanceToShape(outline, p.x, p.y) > -rh)
      add(`bolts[${i}].position`, "bolt hole lies outside the flange outline");
    else if (bore && signedDistanceToShape(bore, p.x, p.y) < rh)
      add(`bolts[${i}].position`, "bolt hole cuts into the bore");
  });
  const hash = buildPointHash(
    pts.map((p) => p.x),
    pts.map((p) => p.y),
    2 * rh,
  );
  pts.forEach((p, i) => {
    forEachNear(hash, p.x, p.y, 2 * rh, (j, d2) => {
      if (j < i && d2 < 4 * rh * rh)
        add(
          `bolts[${i}].position`,
          `bolt hole overlaps the hole of bolt "${design.bolts[j].id}" (bolts[${j}])`,
        );
    });
  });

  const g = design.gasket;
  if (g.kind === "ring") {
    if (g.geometry.kind === "annulus") {
      const { innerDiameterMm: id, outerDiameterMm: od } = g.geometry;
      if (od <= id) add("gasket.geometry.outerDiameterMm", "must be larger than the inner diameter");
      const ring = (r: number) =>
        Array.from({ length: 256 }, (_, k) => ({
          x: r * fm.cos((k * Math.PI) / 128),
          y: r * fm.sin((k * Math.PI) / 128),
        }));
      if (od > 0 && maxSdf(outline, ring(od / 2)) >= 0)
        add("gasket.geometry.outerDiameterMm", "ring gasket extends beyond the flange outline");
      if (bore && id > 0 && ring(id / 2).some((p) => signedDistanceToShape(bore, p.x, p.y) < -1e-6))
        add("gasket.geometry.innerDiameterMm", "ring gasket inner edge lies inside the bore");
      pts.forEach((p, i) => {
        const r = Math.hypot(p.x, p.y);
        if (r + rh > id / 2 && r - rh < od / 2)
          add(
            "gasket.geometry",
            `ring gasket overlaps the hole of bolt "${design.bolts[i].id}" (bolts[${i}])`,
          );
      });
    } else {
      const { centreOffsetMm: c, widthMm: w } = g.geometry;
      if (!(c - w / 2 >= 0))
        add("gasket.geometry.centreOffsetMm", "ring gasket band extends beyond the flange outline");
      else if (bore && w > 0) {
        // The band's inner edge, at depth c + w/2 below the outline, must stay on the face: a band
        // reaching over the opening has no flange under it to seat on.
        const inner = getBoltPath(design.outline, { kind: "offset", offsetMm: c + w / 2 });
        const overBore =
          inner.lengthMm <= 0 ||
          pathToPolyline(inner, Math.max(1, inner.lengthMm / 2000)).some(
            (p) => signedDistanceToShape(bore, p.x, p.y) < -1e-6,
          );
        if (overBore)
          add(
            "gasket.geometry.centreOffsetMm",
            "ring gasket band reaches over the bore: its inner edge (centre offset + width/2) lies inside the opening",
          );
      }
      pts.forEach((p, i) => {
        const d = -signedDistanceToShape(outline, p.x, p.y);
        if (Math.abs(d - c) < w / 2 + rh)
          add(
            "gasket.geometry",
            `ring gasket overlaps the hole of bolt "${design.bolts[i].id}" (bolts[${i}])`,
          );
      });
    }
  }
  return issues;
}
