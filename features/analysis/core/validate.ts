/**
 * Validity checks of a design document that need geometry or catalogue knowledge. Pure: returns
 * a list of issues, each naming the field path the way an editor would show it
 * (`bolts[3].position: bolt hole lies outside the flange outline`). The zod schema calls this
 * from a refinement; `analyzeJoint` refuses a design with issues.
 */
import type { JointDesign, Outline, PointMm } from "./design";
import { MAX_BOLT_COUNT } from "./design";
import { getBoltPath, getBoltPoint, outlineToPolyline } from "./geometry";
import { pathToPolyline } from "./path";
import { buildPointHash, forEachNear } from "./point-hash";
import { outlineToShape, signedDistanceToShape, type Shape } from "./shape";
import { findThread } from "./catalogue/threads";
import { getBoltMaterialById } from "./catalogue/bolt-materials";
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

function outlineNumbers(o: Outline): [string, number][] {
  switch (o.kind) {
    case "circle":
      return [["diameterMm", o.diameterMm]];
    case "rectangle":
      return [
        ["widthMm", o.widthMm],
        ["heightMm", o.heightMm],
      ];
    case "obround":
      return [
        ["lengthMm", o.lengthMm],
        ["widthMm", o.widthMm],
      ];
    case "polygon":
      return [];
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
  const positive = (path: string, v: number) => {
    if (!Number.isFinite(v)) add(path, "must be a finite number");
    else if (v <= 0) add(path, "must be greater than zero");
  };

  if (design.schemaVersion !== 1) add("schemaVersion", "unsupported schema version (expected 1)");
  for (const [k, v] of outlineNumbers(design.outline)) positive(`outline.${k}`, v);
  if (design.outline.kind === "polygon" && design.outline.points.length < 3)
    add("outline.points", "a polygon needs at least 3 points");
  if (design.bore) for (const [k, v] of outlineNumbers(design.bore)) positive(`bore.${k}`, v);
  if (design.boltPath.kind === "circle") positive("boltPath.diameterMm", design.boltPath.diameterMm);
  else positive("boltPath.offsetMm", design.boltPath.offsetMm);
  const f = design.fastener;
  positive("fastener.lengthMm", f.lengthMm);
  positive("fastener.holeDiameterMm", f.holeDiameterMm);
  if (f.washer) {
    positive("fastener.washer.thicknessMm", f.washer.thicknessMm);
    positive("fastener.washer.outerDiameterMm", f.washer.outerDiameterMm);
  }
  if (f.termination.kind === "tapped-hole") {
    positive("fastener.termination.engagementMm", f.termination.engagementMm);
    positive("fastener.termination.memberThicknessMm", f.termination.memberThicknessMm);
    positive("fastener.termination.memberModulusMpa", f.termination.memberModulusMpa);
  }
  const gm = design.gasket.material;
  positive("gasket.material.modulusMpa", gm.modulusMpa);
  positive("gasket.material.thicknessMm", gm.thicknessMm);
  if (!(gm.m >= 0)) add("gasket.material.m", "must be zero or positive");
  if (!(gm.yMpa >= 0)) add("gasket.material.yMpa", "must be zero or positive");
  design.layers.forEach((l, i) => {
    if (l.role !== "gasket") {
      positive(`layers[${i}].thicknessMm`, l.thicknessMm);
      positive(`layers[${i}].modulusMpa`, l.modulusMpa);
    }
  });
  const gasketLayers = design.layers.filter((l) => l.role === "gasket").length;
  if (gasketLayers !== 1) add("layers", `exactly one layer must be the gasket (found ${gasketLayers})`);
  if (design.layers.length - gasketLayers < 1) add("layers", "at least one flange or cover layer is needed");
  positive("assembly.nutFactor.value", design.assembly.nutFactor.value);
  positive("assembly.preload.value", design.assembly.preload.value);
  const so = design.assembly.scatterOverride;
  if (so !== null && !(so >= 0 && so < 1))
    add("assembly.scatterOverride", "must be a fraction between 0 and 1");
  const est = design.estimator;
  if (!(Number.isInteger(est.samplesPerPitch) && est.samplesPerPitch >= 8 && est.samplesPerPitch <= 1024))
    add("estimator.samplesPerPitch", "must be an integer from 8 to 1024");
  if (est.coneAngle.mode === "fixed" && !(est.coneAngle.degrees >= 5 && est.coneAngle.degrees <= 60))
    add("estimator.coneAngle.degrees", "must be between 5° and 60°");
  for (const k of ["nx", "ny"] as const) {
    if (!(Number.isInteger(est.grid[k]) && est.grid[k] >= 2 && est.grid[k] <= 2048))
      add(`estimator.grid.${k}`, "must be an integer from 2 to 2048");
  }
  const n = design.bolts.length;
  if (n < 1 || n > MAX_BOLT_COUNT)
    add("bolts", `bolt count must be between 1 and ${MAX_BOLT_COUNT} (got ${n})`);
  const thread = findThread(f.designation, f.threadSeries);
  if (!thread)
    add("fastener.designation", `no ${f.threadSeries} thread "${f.designation}" in the thread catalogue`);
  if (!getBoltMaterialById(f.materialId))
    add("fastener.materialId", `unknown bolt material "${f.materialId}"`);
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
      positive("gasket.geometry.innerDiameterMm", id);
      positive("gasket.geometry.outerDiameterMm", od);
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
      positive("gasket.geometry.widthMm", w);
      if (!(c - w / 2 >= 0))
        add("gasket.geometry.centreOffsetMm", "ring gasket band extends beyond the flange outline");
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
