/**
 * Resolves a validated design into the numbers every later step needs: catalogue rows, grip,
 * stiffnesses, cone angle and footprint, beam parameters, preload window and external loads.
 * Units: mm, N, MPa, N/mm, N·mm².
 */
import type { JointDesign, PointMm } from "./design";
import { getBoltPath, getBoltPoint, getNeighbourSpacings } from "./geometry";
import type { ClosedPath } from "./path";
import { buildGasketRegion, type GasketRegion } from "./gasket-region";
import { offsetShape, outlineToShape, shapeAreaMm2, signedDistanceToShape } from "./shape";
import { findThread, type ThreadRow } from "./catalogue/threads";
import {
  boltMaterialOf,
  getStrengthForDiameter,
  type BoltMaterialRow,
  type StrengthRange,
} from "./catalogue/bolt-materials";
import { findNut, type NutRow } from "./catalogue/nuts";
import { fastenerThreadLengthMm } from "./catalogue/thread-length";
import { computeBoltStiffnessNPerMm, computeGripMm, splitGripMm } from "./bolt-stiffness";
import {
  computeMemberStiffness,
  frustumCorrection,
  wilemanMemberStiffnessNPerMm,
  type FrustumResult,
} from "./member-stiffness";
import { resolveConeAngle } from "./cone-angle";
import { interfaceFootprint } from "./interface-footprint";
import {
  FLEXIBLE_BEARING_STIFFNESS_FACTOR,
  FRUSTUM_STIFFNESS_CORRECTION,
  INTERFACE_CALIBRATION_SOURCE,
} from "./catalogue/interface-calibration";
import { LINEAR_SHAPE, type FootprintShape } from "./cone-superposition";
import { chooseEstimator } from "./estimator-choice";
import { foundationLambdaPerMm, periodicBeamCompliancePerN } from "./beam-foundation";
import { jointConstant, distributeExternalLoadN } from "./joint-loads";
import { applyScatterN, computeTargetPreloadN, effectiveProofMpa, resolveScatter } from "./preload";
import { asmeGasketGeometry, type AsmeGasketGeometry } from "./asme-gasket-width";
import * as fm from "./fixed-math";

export interface JointModel {
  design: JointDesign;
  region: GasketRegion;
  boltPath: ClosedPath;
  boltPoints: PointMm[];
  thread: ThreadRow;
  material: BoltMaterialRow;
  strength: StrengthRange;
  nut: NutRow | null;
  nominalDiameterMm: number;
  bearingDiameterMm: number;
  gripMm: number;
  shankInGripMm: number;
  threadInGripMm: number;
  threadLengthMm: number;
  boltStiffnessNPerMm: number;
  memberStiffnessNPerMm: number;
  frusta: FrustumResult[];
  gasketSpringNPerMm: number | null;
  jointConstant: number;
  /** Which model gave the clamped-part stiffness km that feeds the joint constant, in words. */
  memberStiffnessBasis: string;
  /** How the bearing face (washer or nut/head face) was idealised. */
  washerActsAs: "rigid" | "flexible";
  holeDiameterMm: number;
  /** The fit of Wileman, Choudury & Green, shown only where its assumptions hold (see `assumptions`). */
  wileman: {
    stiffnessNPerMm: number;
    coneMetalOnlyNPerMm: number;
    ratio: number;
    assumptions: string;
  } | null;
  coneAngleDeg: number;
  coneAngleRule: string;
  /** Depth from the bearing face to the gasket plane, and the cone footprint radius there, mm. */
  coneDepthMm: number;
  coneRadiusMm: number;
  /** Pressure shape of each footprint, (1 − ξ^a)^b, and the rule that gave rc and the shape. */
  footprintShape: FootprintShape;
  footprintRule: string;
  flexuralRigidityNmm2: number;
  /** Winkler modulus per unit path length k = Eg·wg/tg, N/mm². */
  foundationModulusMpa: number;
  lambdaPerMm: number;
  preload: {
    targetN: number;
    minN: number;
    maxN: number;
    scatter: number;
    scatterSource: string;
    rule: string;
    proofMpa: number;
    proofEstimated: boolean;
  };
  pressureAreaMm2: number;
  pressureAreaBasis: string;
  asmeGeometry: AsmeGasketGeometry | null;
  externalLoadPerBoltN: number[];
  notes: string[];
}

function median(values: number[]): number {
  const s = [...values].sort((a, b) => a - b);
  return s.length === 0 ? Infinity : s[Math.floor((s.length - 1) / 2)];
}

/** Builds the joint model of a design that `validateJointDesign` accepted. */
export function buildJointModel(design: JointDesign): JointModel {
  const notes: string[] = [];
  const f = design.fastener;
  const thread = findThread(f.designation, f.threadSeries)!;
  const material = boltMaterialOf(f)!;
  const d = thread.nominalDiameterMm;
  const strength = getStrengthForDiameter(material, d);
  const nut = findNut(thread.designation, f.nutSeries ?? "iso-4032") ?? null;
  const region = buildGasketRegion(design);
  const boltPath = getBoltPath(design.outline, design.boltPath);
  const boltPoints = design.bolts.map((b) => getBoltPoint(boltPath, b));
  const n = boltPoints.length;
  const gm = design.gasket.material;
  const fullFace = design.gasket.kind === "full-face";

  const gi = design.layers.findIndex((l) => l.role === "gasket");
  const plate = (l: JointDesign["layers"][number]) =>
    l.role === "gasket"
      ? { thicknessMm: gm.thicknessMm, modulusMpa: gm.modulusMpa }
      : { thicknessMm: l.thicknessMm, modulusMpa: l.modulusMpa };
  const above = design.layers.slice(0, gi).map(plate);
  const below = design.layers.slice(gi + 1).map(plate);
  const clamped = design.layers.reduce((a, l) => a + plate(l).thicknessMm, 0);
  const tapped = f.termination.kind === "tapped-hole" ? f.termination : null;
  const washerT = f.washer?.thicknessMm ?? 0;
  const gripMm = computeGripMm({
    clampedThicknessMm: clamped,
    washerThicknessMm: washerT,
    nominalDiameterMm: d,
    tappedMemberThicknessMm: tapped ? tapped.memberThicknessMm : null,
  });
  const threadLengthMm = fastenerThreadLengthMm(f.form, f.threadSeries === "metric-coarse", d, f.lengthMm);
  const split = splitGripMm(gripMm, f.lengthMm, threadLengthMm);
  const boltStiffnessNPerMm = computeBoltStiffnessNPerMm({
    nominalDiameterMm: d,
    tensileStressAreaMm2: thread.tensileStressAreaMm2,
    shankInGripMm: split.shankMm,
    threadInGripMm: split.threadMm,
    modulusMpa: material.modulusMpa,
  });

  const holeDiameterMm = f.holeDiameterMm;
  const bearingNominalMm = f.washer ? f.washer.outerDiameterMm : 1.5 * d;
  // The frustum needs a bearing face wider than the hole; a nut face over an oversize hole is
  // taken as 1.05 × the hole (and said so).
  const bearingDiameterMm = Math.max(bearingNominalMm, 1.05 * holeDiameterMm);
  const washerActsAs = f.washerActsAs ?? "rigid";
  notes.push(
    `Member stiffness: frusta from the entered hole ${holeDiameterMm.toFixed(2)} mm (d = ${d.toFixed(2)} mm) and a bearing face of ${bearingDiameterMm.toFixed(1)} mm (${f.washer ? "washer OD" : "≈ 1.5·d nut or head face"}${bearingDiameterMm > bearingNominalMm ? ", widened to 1.05 × the hole" : ""}); the bearing acts as ${washerActsAs === "rigid" ? "rigid (design input)" : `flexible (design input: uniform pressure, km × ${FLEXIBLE_BEARING_STIFFNESS_FACTOR} from the FE calibration)`}.`,
  );
  const spacings = getNeighbourSpacings(design);
  const outline = outlineToShape(design.outline);
  const minEdge = Math.min(...boltPoints.map((p) => -signedDistanceToShape(outline, p.x, p.y)));
  const availableDiameterMm = Math.min(median(spacings.map((s) => s.chordMm)), 2 * minEdge);
  const cone = resolveConeAngle(design.estimator.coneAngle, gripMm, bearingDiameterMm, availableDiameterMm);
  const tan = fm.tan((cone.degrees * Math.PI) / 180);

  const stack: { thicknessMm: number; modulusMpa: number }[] = [];
  stack.push(...above);
  if (fullFace) stack.push({ thicknessMm: gm.thicknessMm, modulusMpa: gm.modulusMpa });
  stack.push(...below);
  const metal = [...above, ...below];
  if (tapped) {
    const part = {
      thicknessMm: Math.min(tapped.memberThicknessMm, d) / 2,
      modulusMpa: tapped.memberModulusMpa,
    };
    stack.push(part);
    metal.push(part);
  }
  // With the thickness-dependent cone the frusta carry the FE correction for the plates' thickness
  // (the fixed angle is the textbook model, left as it is).
  const calibrated = design.estimator.coneAngle.mode === "thickness-dependent";
  const metalGripMm = metal.reduce((a, m) => a + m.thicknessMm, 0);
  const correction = calibrated ? frustumCorrection(metalGripMm, d, FRUSTUM_STIFFNESS_CORRECTION) : 1;
  const bearingFactor = (washerActsAs === "flexible" ? FLEXIBLE_BEARING_STIFFNESS_FACTOR : 1) * correction;
  const frustaOf = (layers: { thicknessMm: number; modulusMpa: number }[]) => {
    const m = computeMemberStiffness({
      layers,
      bearingDiameterMm,
      holeDiameterMm,
      coneAngleDeg: cone.degrees,
    });
    return {
      stiffnessNPerMm: m.stiffnessNPerMm * bearingFactor,
      frusta: m.frusta.map((x) => ({ ...x, stiffnessNPerMm: x.stiffnessNPerMm * bearingFactor })),
    };
  };
  const members = frustaOf(stack);
  const gasketSpringNPerMm = fullFace ? null : ((region.areaMm2 / n) * gm.modulusMpa) / gm.thicknessMm;
  let memberStiffnessNPerMm =
    gasketSpringNPerMm === null
      ? members.stiffnessNPerMm
      : 1 / (1 / members.stiffnessNPerMm + 1 / gasketSpringNPerMm);
  let memberStiffnessBasis = fullFace
    ? "pressure-cone frusta through the whole stack, the full-face gasket as one frustum layer"
    : "pressure-cone frusta of the flanges in series with the ring gasket kg = (gasket area / n)·Eg/tg";
  if (calibrated)
    memberStiffnessBasis += ` (frusta × ${correction.toFixed(3)}, the FE correction for grip/2d = ${(metalGripMm / (2 * d)).toFixed(2)})`;
  let wileman: JointModel["wileman"] = null;
  const e0 = metal[0]?.modulusMpa ?? 0;
  const similar = metal.length > 0 && metal.every((m) => Math.abs(m.modulusMpa - e0) <= 0.01 * e0);
  const holeIsD = Math.abs(holeDiameterMm / d - 1) <= 0.02;
  const bearingIs15d = Math.abs(bearingDiameterMm / (1.5 * d) - 1) <= 0.05;
  if (similar && holeIsD && bearingIs15d && washerActsAs === "rigid") {
    const w = wilemanMemberStiffnessNPerMm(e0, d, metalGripMm, "steel");
    const c = frustaOf(metal).stiffnessNPerMm;
    wileman = {
      stiffnessNPerMm: w,
      coneMetalOnlyNPerMm: c,
      ratio: c / w,
      assumptions:
        "shown because its assumptions hold: hole = d (±2 %), bearing face 1.5·d (±5 %), rigid bearing, members of one material; fit constants [mem], an information only, never a pass/fail",
    };
  } else {
    const why = [
      !similar ? "members of different materials" : null,
      !holeIsD ? `hole ${(holeDiameterMm / d).toFixed(2)}·d, not d` : null,
      !bearingIs15d ? `bearing ${(bearingDiameterMm / d).toFixed(2)}·d, not 1.5·d` : null,
      washerActsAs !== "rigid" ? "flexible bearing" : null,
    ].filter(Boolean);
    notes.push(
      `Wileman–Choudury–Green stiffness fit not shown: its assumptions (hole = d, bearing 1.5·d, rigid bearing, one material) do not hold here (${why.join(", ")}).`,
    );
  }

  const hTop = above.reduce((a, l) => a + l.thicknessMm, 0);
  const hBottom = tapped ? Infinity : below.reduce((a, l) => a + l.thicknessMm, 0);
  const coneDepthMm = Math.min(hTop, hBottom);
  let coneRadiusMm: number;
  let footprintShape: FootprintShape;
  let footprintRule: string;
  if (design.estimator.coneAngle.mode === "thickness-dependent") {
    // The two layers that meet at the gasket plane (or the interface) set the modulus ratio.
    const eUp = above.length ? above[above.length - 1].modulusMpa : 0;
    const eDown = below.length ? below[0].modulusMpa : tapped ? tapped.memberModulusMpa : eUp;
    const fp = interfaceFootprint({
      depthMm: coneDepthMm,
      nominalDiameterMm: d,
      bearingDiameterMm,
      holeDiameterMm,
      modulusLogRatio: eUp > 0 && eDown > 0 ? Math.abs(fm.log(eUp / eDown)) : 0,
    });
    coneRadiusMm = fp.outerRadiusMm;
    footprintShape = { a: fp.shapeA, b: fp.shapeB };
    footprintRule = `calibrated footprint: rc = Dw/2 + h·tanφc, contact angle φc = ${((fm.atan(fp.contactTangent) * 180) / Math.PI).toFixed(1)}° at h/d = ${(coneDepthMm / d).toFixed(2)}, pressure (1 − ξ^${fp.shapeA.toFixed(2)})^${fp.shapeB.toFixed(2)} from the hole edge (${INTERFACE_CALIBRATION_SOURCE}; h/d outside 0.5–4 uses the nearest end)`;
  } else {
    coneRadiusMm = Math.max(bearingDiameterMm / 2 + coneDepthMm * tan, holeDiameterMm / 2 + 1e-6);
    footprintShape = LINEAR_SHAPE;
    footprintRule = `fixed cone: rc = Dw/2 + h·tan${cone.degrees}°, pressure falling linearly from the hole edge to rc`;
  }

  const b = region.stripWidthMm;
  const ei = (layers: { thicknessMm: number; modulusMpa: number }[]) =>
    layers.reduce((a, l) => a + (l.modulusMpa * b * fm.pow(l.thicknessMm, 3)) / 12, 0);
  const eiTop = ei(above);
  const eiBottom =
    ei(below) + (tapped ? (tapped.memberModulusMpa * b * fm.pow(tapped.memberThicknessMm, 3)) / 12 : 0);
  const flexuralRigidityNmm2 =
    eiBottom > 0 && eiTop > 0 ? 1 / (1 / eiTop + 1 / eiBottom) : Math.max(eiTop, eiBottom);
  const foundationModulusMpa = (gm.modulusMpa * region.foundationWidthMm) / gm.thicknessMm;
  const lambdaPerMm = foundationLambdaPerMm(foundationModulusMpa, flexuralRigidityNmm2);

  // A soft full-face gasket under a stiff flange: where the beam on an elastic foundation governs,
  // the flange spreads each bolt's load along the path, so the gasket is not one frustum layer:
  // the clamped parts are the metal frusta (local compression) in series with the beam's
  // deflection under the bolt, w/F of the periodic infinite beam (linear, before any lift-off).
  if (fullFace) {
    const pre = chooseEstimator({
      requested: design.estimator.estimator,
      lambdaPerMm,
      coneRadiusMm,
      coneMissesGasket: false,
    });
    if (pre.estimator === "beam") {
      const pitch = region.path.lengthMm / n;
      const beamCompliance = periodicBeamCompliancePerN(lambdaPerMm, foundationModulusMpa, pitch);
      const metalOnly = frustaOf(metal).stiffnessNPerMm;
      memberStiffnessNPerMm = 1 / (1 / metalOnly + beamCompliance);
      memberStiffnessBasis = `beam on elastic foundation (governing): metal frusta ${metalOnly.toExponential(3)} N/mm in series with the flange-on-gasket deflection under a bolt w/F = ${beamCompliance.toExponential(3)} mm/N (periodic infinite beam, pitch ${pitch.toFixed(1)} mm)`;
    }
  }
  notes.push(`Clamped-part stiffness km from ${memberStiffnessBasis}.`);

  const proof = effectiveProofMpa({
    tensileStressAreaMm2: thread.tensileStressAreaMm2,
    rootAreaMm2: thread.rootAreaMm2,
    proofMpa: strength.proofMpa,
    yieldMpa: strength.yieldMpa,
  });
  const target = computeTargetPreloadN(design.assembly.preload, {
    tensileStressAreaMm2: thread.tensileStressAreaMm2,
    rootAreaMm2: thread.rootAreaMm2,
    proofMpa: strength.proofMpa,
    yieldMpa: strength.yieldMpa,
  });
  const scatter = resolveScatter(design.assembly);
  const window = applyScatterN(target.targetN, scatter.scatter);

  let asmeGeometry: AsmeGasketGeometry | null = null;
  let pressureAreaMm2: number;
  let pressureAreaBasis: string;
  const g = design.gasket;
  if (g.kind === "ring" && g.geometry.kind === "annulus") {
    asmeGeometry = asmeGasketGeometry(
      g.geometry.outerDiameterMm,
      g.geometry.innerDiameterMm,
      design.units === "US" ? "inch" : "metric",
    );
    pressureAreaMm2 = (Math.PI / 4) * asmeGeometry.gMm ** 2;
    pressureAreaBasis = "π/4·G² (ASME VIII-1 Appendix 2)";
  } else if (g.kind === "ring" && g.geometry.kind === "band") {
    pressureAreaMm2 = shapeAreaMm2(offsetShape(outline, g.geometry.centreOffsetMm));
    pressureAreaBasis = "area enclosed by the gasket centre line (generalisation of π/4·G²) [practice]";
  } else {
    pressureAreaMm2 =
      design.boltPath.kind === "circle"
        ? (Math.PI / 4) * design.boltPath.diameterMm ** 2
        : shapeAreaMm2(offsetShape(outline, design.boltPath.offsetMm));
    pressureAreaBasis =
      "area enclosed by the bolt path (full-face gasket: pressure assumed to reach the bolt line) [practice]";
  }
  const totalAxialN = design.loads.designPressureMpa * pressureAreaMm2 + design.loads.axialLoadN;
  const externalLoadPerBoltN = distributeExternalLoadN(boltPoints, totalAxialN, design.loads.momentNmm);

  return {
    design,
    region,
    boltPath,
    boltPoints,
    thread,
    material,
    strength,
    nut,
    nominalDiameterMm: d,
    bearingDiameterMm,
    gripMm,
    shankInGripMm: split.shankMm,
    threadInGripMm: split.threadMm,
    threadLengthMm,
    boltStiffnessNPerMm,
    memberStiffnessNPerMm,
    frusta: members.frusta,
    gasketSpringNPerMm,
    jointConstant: jointConstant(boltStiffnessNPerMm, memberStiffnessNPerMm),
    memberStiffnessBasis,
    washerActsAs,
    holeDiameterMm,
    wileman,
    coneAngleDeg: cone.degrees,
    coneAngleRule: cone.rule,
    coneDepthMm,
    coneRadiusMm,
    footprintShape,
    footprintRule,
    flexuralRigidityNmm2,
    foundationModulusMpa,
    lambdaPerMm,
    preload: {
      targetN: target.targetN,
      minN: window.minN,
      maxN: window.maxN,
      scatter: scatter.scatter,
      scatterSource: scatter.source,
      rule: target.note,
      proofMpa: proof.proofMpa,
      proofEstimated: proof.estimated,
    },
    pressureAreaMm2,
    pressureAreaBasis,
    asmeGeometry,
    externalLoadPerBoltN,
    notes,
  };
}
