/**
 * Gasket path check (FE cross-check, model 2) of a design: maps the joint to the plate-on-gasket
 * model of `gasket-path-model.ts` and sets its FE gasket stress beside the estimate's, sampled at
 * the same arc lengths s as the core's path profile (`computeGasketStressProfiles`: s from the
 * top centre, clockwise, n × samplesPerPitch equal steps) so the two curves overlay. Pure.
 *
 * Model choice:
 * - a regular circular pattern (the core's `isRegularCircularPattern`: circular outline and bore,
 *   equal pitch on a centred bolt circle, annulus or full-face gasket) is one half pitch, from a
 *   bolt's centre line to the mid-pitch line, with both as symmetry planes ("circular-sector");
 * - every other design (covers, rectangular, obround and polygonal flanges, irregular patterns) is
 *   the whole plate ("whole-plate"), held in its plane by statically determinate pins.
 *
 * Equivalent plate: the relative approach w of the two flanges (what compresses the gasket) obeys
 * D1∇⁴w1 = D2∇⁴w2 = q_bolts − q_gasket, so w = w1 + w2 satisfies D∇⁴w = q_bolts − q_gasket with
 * 1/D = 1/D1 + 1/D2: one plate of flexural rigidity D on the gasket foundation, loaded by the
 * bolts, gives the gasket stress of the pair (thin-plate theory, both sides the same planform,
 * the core's beam estimate makes the same series combination). Each side's D is the sum of its
 * layers' E·t³/(12(1 − ν²)) (layers not bonded, as in the core; a tapped member counts below).
 * The plate is made of the upper side's first layer's metal, of thickness t = (12(1 − ν²)D/E)^⅓.
 */
import type { JointDesign, PointMm } from "@/features/analysis/core/design";
import { buildJointModel, type JointModel } from "@/features/analysis/core/joint-model";
import {
  computeGasketStressProfiles,
  governingProfile,
  isRegularCircularPattern,
} from "@/features/analysis/core/gasket-stress";
import { isOnGasket } from "@/features/analysis/core/gasket-region";
import { shapeToPath, type ClosedPath } from "@/features/analysis/core/path";
import { offsetShape, outlineToShape, shapeBounds } from "@/features/analysis/core/shape";
import { formatIssue, validateJointDesign } from "@/features/analysis/core/validate";
import { FeInputError, METAL_POISSON } from "./joint-stack";
import type { Circle, GasketPathProblem, PlateLoad } from "./gasket-path-model";

export type GasketPathModelKind = "circular-sector" | "whole-plate";

/** Most elements (plate cells + gasket cells) a gasket path run may have. */
export const GASKET_PATH_ELEMENT_CAP = 60_000;

export interface EquivalentPlate {
  thicknessMm: number;
  modulusMpa: number;
  poisson: number;
  /** D = E·t³/(12(1 − ν²)) of the plate, N·mm. */
  flexuralRigidityNmm: number;
  /** Each side's D, N·mm (the upper side first). */
  sidesNmm: [number, number];
}

export function equivalentPlate(model: JointModel): EquivalentPlate {
  const design = model.design;
  const nu = METAL_POISSON;
  const gi = design.layers.findIndex((l) => l.role === "gasket");
  const d = (E: number, t: number) => (E * t ** 3) / (12 * (1 - nu * nu));
  const side = (ls: JointDesign["layers"]) =>
    ls.reduce((a, l) => (l.role === "gasket" ? a : a + d(l.modulusMpa, l.thicknessMm)), 0);
  const top = side(design.layers.slice(0, gi));
  const term = design.fastener.termination;
  const bottom =
    side(design.layers.slice(gi + 1)) +
    (term.kind === "tapped-hole" ? d(term.memberModulusMpa, term.memberThicknessMm) : 0);
  if (!(top > 0) && !(bottom > 0))
    throw new FeInputError("The gasket path check needs a metal layer beside the gasket.");
  const D = top > 0 && bottom > 0 ? 1 / (1 / top + 1 / bottom) : Math.max(top, bottom);
  const first = design.layers.find((l) => l.role !== "gasket");
  const E = first && "modulusMpa" in first ? first.modulusMpa : 200_000;
  return {
    thicknessMm: Math.cbrt((12 * (1 - nu * nu) * D) / E),
    modulusMpa: E,
    poisson: nu,
    flexuralRigidityNmm: D,
    sidesNmm: [top, bottom],
  };
}

export interface GasketPathPlan {
  kind: GasketPathModelKind;
  problem: GasketPathProblem;
  model: JointModel;
  plate: EquivalentPlate;
  /** Foundation stiffness Eg/tg, N/mm³. */
  kPerAreaMpaPerMm: number;
  /** Minimum preload of each bolt, N, and how many bolts' loads the model carries (½ for a sector). */
  boltForceN: number;
  boltsInModel: number;
  /** A point of the joint (flange coordinates) in the model's coordinates (a sector folds it in). */
  toModel: (x: number, y: number) => [number, number];
  elementSizeMm: number;
}

/** Element size: resolves the plate (t/2), the bending wave (0.2/λ), the ring gasket's width (w/4) and the pitch (p/12). */
export function gasketPathElementSizeMm(model: JointModel, plate: EquivalentPlate, refine = 1): number {
  const g = model.design.gasket;
  const k = g.material.modulusMpa / g.material.thicknessMm;
  const lambda = Math.pow(k / (4 * plate.flexuralRigidityNmm), 0.25);
  const region = model.region;
  const width =
    region.kind === "annulus"
      ? region.outerRadiusMm - region.innerRadiusMm
      : region.kind === "band"
        ? region.bandWidthMm
        : Infinity;
  const pitch = model.boltPath.lengthMm / model.boltPoints.length;
  return Math.min(plate.thicknessMm / 2, 0.2 / lambda, width / 4, pitch / 12) / refine;
}

const ELEMENTS_PER_TURN = 16;

function annulusLoad(label: string, c: PointMm, ri: number, rb: number, forceN: number): PlateLoad {
  return {
    label,
    forceN,
    inside: (x, y) => {
      const r = Math.hypot(x - c.x, y - c.y);
      return r >= ri && r <= rb;
    },
  };
}

/** Maps a validated design to the model. Throws FeInputError for what the model does not cover. */
export function planGasketPath(design: JointDesign, refine = 1): GasketPathPlan {
  const issues = validateJointDesign(design);
  if (issues.length) throw new FeInputError(`The design is not valid: ${issues.map(formatIssue).join("; ")}`);
  const model = buildJointModel(design);
  const plate = equivalentPlate(model);
  const gm = design.gasket.material;
  const kPerArea = gm.modulusMpa / gm.thicknessMm;
  const region = model.region;
  const h = gasketPathElementSizeMm(model, plate, refine);
  const ri = model.holeDiameterMm / 2;
  const rb = Math.max(model.bearingDiameterMm / 2, ri * 1.05);
  const F = model.preload.minN;
  const outline = outlineToShape(design.outline);
  const gasketCurves = (): { paths: ClosedPath[]; circles: Circle[] } => {
    if (region.kind === "annulus")
      return {
        paths: [],
        circles: [region.innerRadiusMm, region.outerRadiusMm].map((r) => ({ x: 0, y: 0, r })),
      };
    if (region.kind === "band") {
      const c = region.bandCentreOffsetMm;
      const w = region.bandWidthMm;
      return { paths: [c - w / 2, c + w / 2].map((o) => shapeToPath(offsetShape(outline, o))), circles: [] };
    }
    return { paths: [], circles: [] };
  };
  const base = {
    outer: shapeToPath(outline),
    inner: design.bore ? shapeToPath(outlineToShape(design.bore)) : null,
    elementSizeMm: h,
    elementsPerTurn: Math.round(ELEMENTS_PER_TURN * refine),
  };
  const pl = { thicknessMm: plate.thicknessMm, modulusMpa: plate.modulusMpa, poisson: plate.poisson };
  const gasket = { thicknessMm: gm.thicknessMm, modulusMpa: gm.modulusMpa };
  const n = model.boltPoints.length;
  if (isRegularCircularPattern(design)) {
    const p0 = model.boltPoints[0];
    const phi0 = Math.atan2(p0.y, p0.x);
    const R = Math.hypot(p0.x, p0.y);
    const alpha = Math.PI / n;
    const bolt = { x: R, y: 0 };
    const curves = gasketCurves();
    const c = Math.cos(phi0);
    const s = Math.sin(phi0);
    const period = 2 * alpha;
    return {
      kind: "circular-sector",
      model,
      plate,
      kPerAreaMpaPerMm: kPerArea,
      boltForceN: F,
      boltsInModel: 0.5,
      elementSizeMm: h,
      toModel: (x, y) => {
        const r = Math.hypot(x, y);
        let d = (((Math.atan2(y, x) - phi0) % period) + period) % period;
        if (d > alpha) d = period - d;
        return [r * Math.cos(d), r * Math.sin(d)];
      },
      problem: {
        planform: {
          ...base,
          holes: [{ ...bolt, r: ri }],
          wedgeRad: alpha,
          curves: { ...curves, circles: [...curves.circles, { ...bolt, r: rb }], lines: [] },
        },
        plate: pl,
        gasket,
        isGasket: (x, y) => isOnGasket(region, c * x - s * y, s * x + c * y),
        loads: [annulusLoad("bolt 1 (half, in the sector)", bolt, ri, rb, F / 2)],
        symmetry: [
          { px: 0, py: 0, nx: 0, ny: 1 },
          { px: 0, py: 0, nx: -Math.sin(alpha), ny: Math.cos(alpha) },
        ],
        pins: [],
      },
    };
  }
  const curves = gasketCurves();
  const bb = shapeBounds(outline);
  return {
    kind: "whole-plate",
    model,
    plate,
    kPerAreaMpaPerMm: kPerArea,
    boltForceN: F,
    boltsInModel: n,
    elementSizeMm: h,
    toModel: (x, y) => [x, y],
    problem: {
      planform: {
        ...base,
        holes: model.boltPoints.map((p) => ({ x: p.x, y: p.y, r: ri })),
        wedgeRad: null,
        curves: {
          ...curves,
          circles: [...curves.circles, ...model.boltPoints.map((p) => ({ x: p.x, y: p.y, r: rb }))],
          lines: [],
        },
      },
      plate: pl,
      gasket,
      isGasket: (x, y) => isOnGasket(region, x, y),
      loads: model.boltPoints.map((p, i) => annulusLoad(`bolt ${design.bolts[i].id}`, p, ri, rb, F)),
      symmetry: [],
      pins: [
        { x: bb.xMinMm, y: 0, dofs: [1, 2] },
        { x: bb.xMaxMm, y: 0, dofs: [2] },
      ],
    },
  };
}

/** The estimate along the same path at minimum preload (the governing estimator, as the product shows it). */
export function estimateAtMinimumPreload(model: JointModel) {
  const profiles = computeGasketStressProfiles(
    model,
    model.boltPoints.map(() => model.preload.minN),
  );
  const gov = governingProfile(profiles);
  return { profiles, governing: gov };
}
