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
  getBoltMaterialById,
  getStrengthForDiameter,
  type BoltMaterialRow,
  type StrengthRange,
} from "./catalogue/bolt-materials";
import { findNut, type NutRow } from "./catalogue/nuts";
import { fastenerThreadLengthMm } from "./catalogue/thread-length";
import { computeBoltStiffnessNPerMm, computeGripMm, splitGripMm } from "./bolt-stiffness";
import { computeMemberStiffness, wilemanMemberStiffnessNPerMm, type FrustumResult } from "./member-stiffness";
import { resolveConeAngle } from "./cone-angle";
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
  wileman: { stiffnessNPerMm: number; coneMetalOnlyNPerMm: number; ratio: number } | null;
  coneAngleDeg: number;
  coneAngleRule: string;
  /** Depth from the bearing face to the gasket plane, and the cone footprint radius there, mm. */
  coneDepthMm: number;
  coneRadiusMm: number;
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
  const material = getBoltMaterialById(f.materialId)!;
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

  const bearingDiameterMm = f.washer ? f.washer.outerDiameterMm : 1.5 * d;
  notes.push(
    `Member stiffness assumes a hole ≈ d = ${d.toFixed(2)} mm and a bearing face of ${bearingDiameterMm.toFixed(1)} mm (${f.washer ? "washer OD" : "≈ 1.5·d nut face"}); washers are treated as rigid.`,
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
  const members = computeMemberStiffness({
    layers: stack,
    bearingDiameterMm,
    holeDiameterMm: d,
    coneAngleDeg: cone.degrees,
  });
  const gasketSpringNPerMm = fullFace ? null : ((region.areaMm2 / n) * gm.modulusMpa) / gm.thicknessMm;
  const memberStiffnessNPerMm =
    gasketSpringNPerMm === null
      ? members.stiffnessNPerMm
      : 1 / (1 / members.stiffnessNPerMm + 1 / gasketSpringNPerMm);
  if (!fullFace) notes.push("Ring gasket in series with the flange frusta as kg = (gasket area / n)·Eg/tg.");
  let wileman: JointModel["wileman"] = null;
  const e0 = metal[0]?.modulusMpa ?? 0;
  if (metal.length > 0 && metal.every((m) => Math.abs(m.modulusMpa - e0) <= 0.01 * e0)) {
    const lMetal = metal.reduce((a, m) => a + m.thicknessMm, 0);
    const w = wilemanMemberStiffnessNPerMm(e0, d, lMetal, "steel");
    const c = computeMemberStiffness({
      layers: metal,
      bearingDiameterMm,
      holeDiameterMm: d,
      coneAngleDeg: cone.degrees,
    }).stiffnessNPerMm;
    wileman = { stiffnessNPerMm: w, coneMetalOnlyNPerMm: c, ratio: c / w };
  }

  const hTop = above.reduce((a, l) => a + l.thicknessMm, 0);
  const hBottom = tapped ? Infinity : below.reduce((a, l) => a + l.thicknessMm, 0);
  const coneDepthMm = Math.min(hTop, hBottom);
  const coneRadiusMm = bearingDiameterMm / 2 + coneDepthMm * tan;

  const b = region.stripWidthMm;
  const ei = (layers: { thicknessMm: number; modulusMpa: number }[]) =>
    layers.reduce((a, l) => a + (l.modulusMpa * b * fm.pow(l.thicknessMm, 3)) / 12, 0);
  const eiTop = ei(above);
  const eiBottom =
    ei(below) + (tapped ? (tapped.memberModulusMpa * b * fm.pow(tapped.memberThicknessMm, 3)) / 12 : 0);
  const flexuralRigidityNmm2 =
    eiBottom > 0 && eiTop > 0 ? 1 / (1 / eiTop + 1 / eiBottom) : Math.max(eiTop, eiBottom);
  const foundationModulusMpa = (gm.modulusMpa * region.foundationWidthMm) / gm.thicknessMm;
  const lambdaPerMm = fm.pow(foundationModulusMpa / (4 * flexuralRigidityNmm2), 0.25);

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
    wileman,
    coneAngleDeg: cone.degrees,
    coneAngleRule: cone.rule,
    coneDepthMm,
    coneRadiusMm,
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
