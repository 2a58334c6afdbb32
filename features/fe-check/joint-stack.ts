/**
 * Bolt stack check (FE cross-check, model 1) of a design: maps the design's bolt stack (bearing
 * face, hole, clamped layers top to bottom, a full-face gasket as a layer of its own) to the
 * axisymmetric stack model, and sets its FE results beside the estimate's: the pressure p(r) at
 * the gasket plane, the loaded-zone radius and the clamped-part stiffness. Pure except through
 * the `solve` argument (the caller passes `solveStack`, which runs ccx).
 *
 * Stated assumptions: one bolt alone (the plates run to 8·d + 2·stack thickness; neighbours and
 * edges are model 2's business); linear elastic; frictionless compression-only contact between
 * layers; metal ν = 0.3 [mem]; gasket ν = 0, so its through-thickness stiffness is Eg; bearing
 * face rigid or flexible as the design says; the bolt itself is not modelled (its load acts on
 * the bearing annuli).
 */
import type { JointDesign } from "@/features/analysis/core/design";
import type { JointModel } from "@/features/analysis/core/joint-model";
import { footprintIntegralMm2, footprintShapeValue } from "@/features/analysis/core/interface-footprint";
import { buildStackMesh, type StackSpec } from "./stack-model";
import type { StackRunHooks, StackStudy } from "./stack-study";

/** Metal Poisson ratio for every flange and cover layer [mem: 0.27–0.30 for steels]. */
export const METAL_POISSON = 0.3;
/** Most elements a bolt stack run may have. */
export const STACK_ELEMENT_CAP = 40_000;

export class FeInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "FeInputError";
  }
}

export interface StackMapping {
  spec: StackSpec;
  /** Index of the interface at the gasket plane (where the estimate's footprint radius applies). */
  gasketPlaneInterface: number;
  forceN: number;
}

/** Element size of the stack model: d/12 (the engine's convergence check: d/12 and d/24 agree < 2 %). */
export function stackElementSizeMm(model: JointModel, refine = 1): number {
  return model.nominalDiameterMm / 12 / refine;
}

export function mapBoltStack(model: JointModel, refine = 1): StackMapping {
  const design: JointDesign = model.design;
  if (design.fastener.termination.kind === "tapped-hole")
    throw new FeInputError(
      "The bolt stack check models a through bolt with a nut; a stud into a tapped hole is not modelled yet.",
    );
  const gm = design.gasket.material;
  const fullFace = design.gasket.kind === "full-face";
  const layers: StackSpec["layers"] = [];
  let gasketPlaneInterface = -1;
  const gi = design.layers.findIndex((l) => l.role === "gasket");
  const metalThickness = (ls: JointDesign["layers"]) =>
    ls.reduce((a, l) => a + (l.role === "gasket" ? 0 : l.thicknessMm), 0);
  const tAbove = metalThickness(design.layers.slice(0, gi));
  const tBelow = metalThickness(design.layers.slice(gi + 1));
  for (const l of design.layers) {
    if (l.role === "gasket") {
      if (fullFace) {
        // The footprint depth is the shorter way from a bearing face to the gasket.
        gasketPlaneInterface = tAbove <= tBelow ? layers.length - 1 : layers.length;
        layers.push({ name: "gasket", thicknessMm: gm.thicknessMm, modulusMpa: gm.modulusMpa, poisson: 0 });
      } else gasketPlaneInterface = layers.length - 1;
      continue;
    }
    layers.push({
      name: l.materialName || l.role,
      thicknessMm: l.thicknessMm,
      modulusMpa: l.modulusMpa,
      poisson: METAL_POISSON,
    });
  }
  if (layers.length < 2 || gasketPlaneInterface < 0 || gasketPlaneInterface >= layers.length - 1)
    throw new FeInputError("The bolt stack check needs clamped layers on both sides of the gasket.");
  const tSum = layers.reduce((a, l) => a + l.thicknessMm, 0);
  const spec: StackSpec = {
    layers,
    holeDiameterMm: model.holeDiameterMm,
    bearingDiameterMm: model.bearingDiameterMm,
    outerRadiusMm: 8 * model.nominalDiameterMm + 2 * tSum,
    bearing: model.washerActsAs,
    elementSizeMm: stackElementSizeMm(model, refine),
  };
  return { spec, gasketPlaneInterface, forceN: model.preload.minN };
}

export interface PressurePoint {
  rMm: number;
  feMpa: number;
  estimateMpa: number;
}

export interface StackCheckResult {
  forceN: number;
  elements: number;
  nodes: number;
  linearRuns: number;
  /** p(r) at the gasket plane: FE per interface cell, and the estimate's footprint at the same radii. */
  pressure: PressurePoint[];
  fe: {
    loadedRadiusMm: number;
    peakMpa: number;
    memberStiffnessNPerMm: number;
    contactForceRatio: number;
    reactionRatio: number;
  };
  estimate: { loadedRadiusMm: number; peakMpa: number; memberStiffnessNPerMm: number };
  interfaces: { between: [string, string]; loadedRadiusMm: number; peakMpa: number }[];
  assumptions: string[];
}

/** The estimate's stack stiffness: the frusta of the same stack in series (no ring gasket spring, no beam). */
export function estimateStackStiffnessNPerMm(model: JointModel): number {
  return 1 / model.frusta.reduce((a, f) => a + 1 / f.stiffnessNPerMm, 0);
}

/** The estimate's footprint pressure at radius r for force F: p = F·(1 − ξ^a)^b / ∫(1 − ξ^a)^b dA. */
export function estimateFootprintMpa(model: JointModel, forceN: number, rMm: number): number {
  const ri = model.holeDiameterMm / 2;
  const rc = model.coneRadiusMm;
  const { a, b } = model.footprintShape;
  const xi = (rMm - ri) / (rc - ri);
  return (forceN * footprintShapeValue(xi, a, b)) / footprintIntegralMm2(ri, rc, a, b);
}

export async function runStackCheck(
  model: JointModel,
  solve: (spec: StackSpec, forceN: number, hooks?: StackRunHooks) => Promise<StackStudy>,
  opts: { refine?: number; hooks?: StackRunHooks; elementCap?: number } = {},
): Promise<StackCheckResult> {
  const map = mapBoltStack(model, opts.refine ?? 1);
  const cap = opts.elementCap ?? STACK_ELEMENT_CAP;
  const count = buildStackMesh(map.spec).elementCount;
  if (count > cap)
    throw new FeInputError(
      `The bolt stack mesh would have ${count} elements, over the cap of ${cap}; use a coarser refinement.`,
    );
  const study = await solve(map.spec, map.forceN, opts.hooks);
  const plane = study.interfaces[map.gasketPlaneInterface];
  const pressure = plane.cells.map((c) => ({
    rMm: c.rMid,
    feMpa: c.pressureMpa,
    estimateMpa: estimateFootprintMpa(model, map.forceN, c.rMid),
  }));
  const estPeak = Math.max(
    ...pressure.map((p) => p.estimateMpa),
    estimateFootprintMpa(model, map.forceN, model.holeDiameterMm / 2),
  );
  return {
    forceN: map.forceN,
    elements: study.elements,
    nodes: study.nodes,
    linearRuns: study.linearRuns,
    pressure,
    fe: {
      loadedRadiusMm: plane.loadedRadiusMm,
      peakMpa: plane.peakMpa,
      memberStiffnessNPerMm: study.memberStiffnessNPerMm,
      contactForceRatio: plane.contactForceRatio,
      reactionRatio: study.reactionRatio,
    },
    estimate: {
      loadedRadiusMm: model.coneRadiusMm,
      peakMpa: estPeak,
      memberStiffnessNPerMm: estimateStackStiffnessNPerMm(model),
    },
    interfaces: study.interfaces.map((i) => ({
      between: i.between,
      loadedRadiusMm: i.loadedRadiusMm,
      peakMpa: i.peakMpa,
    })),
    assumptions: [
      `Bolt stack: axisymmetric CAX4 model of one bolt alone, plates to r = ${map.spec.outerRadiusMm.toFixed(0)} mm, elements ${map.spec.elementSizeMm.toFixed(2)} mm near the hole; layers ${map.spec.layers.map((l) => `${l.name} ${l.thicknessMm} mm`).join(" / ")}.`,
      "Frictionless compression-only contact between layers; linear elastic; metal ν = 0.3 [mem]; gasket ν = 0 (through-thickness stiffness = Eg).",
      `Bearing face ${model.bearingDiameterMm.toFixed(1)} mm over a ${model.holeDiameterMm.toFixed(2)} mm hole, ${model.washerActsAs === "rigid" ? "rigid (equal approach of the whole face)" : "flexible (uniform pressure)"}; bolt force at minimum preload ${(map.forceN / 1000).toFixed(1)} kN (results scale with the force).`,
      "Stack stiffness compared like for like: the estimate's frusta of the same layers in series, without the ring gasket's spring or the beam term.",
    ],
  };
}
