/**
 * The core's one entry point: `analyzeJoint(design)` returns everything the app, the API, the
 * PDF and the command line show, as plain JSON (arrays, no typed arrays; every number finite).
 * Deterministic: the same design always gives the same result. Units: mm, N, MPa, N·mm.
 *
 * Example: `analyzeJoint(pipeFlangeDesign).summary.governingEstimator` → "beam".
 */
import type { JointDesign } from "./design";
import { CORE_VERSION } from "./version";
import { DesignRefusedError, validateJointDesign } from "./validate";
import { buildJointModel, type JointModel } from "./joint-model";
import { balancedProfiles, profileArrays, type ProfileSummary } from "./gasket-stress";
import { computeSafetyFactors, shareExternalLoad } from "./joint-loads";
import { torqueFromPreloadNmm } from "./torque";
import { getNeighbourSpacings } from "./geometry";
import { buildAssemblyPlan, type AssemblyPlan } from "./assembly";
import { checkGasketStress } from "./checks/gasket-stress-checks";
import { computeAsmeAppendix2, type AsmeAppendix2Result } from "./checks/asme-appendix2";
import { checkBolts } from "./checks/bolt-checks";
import { computeFlangeDesign, type FlangeDesignResult } from "./flange-design/flange-design";
import { checkSpacing } from "./checks/spacing";
import { checkEdgesAndPattern } from "./checks/edge-and-pattern";
import { countChecks, type CheckRecord } from "./checks/check-record";
import { collectCatalogueEditions, type CatalogueEdition } from "./catalogue-editions";
import { toFiniteJson } from "./finite-json";

export interface BoltResult {
  id: string;
  sMm: number;
  xMm: number;
  yMm: number;
  pitchToNextMm: number | null;
  chordToNextMm: number | null;
  preloadTargetN: number;
  preloadMinN: number;
  preloadMaxN: number;
  torqueNmm: number;
  externalLoadN: number;
  /** Bolt load Fi + C·P and clamp load Fi − (1 − C)·P at the target preload, N. */
  boltLoadN: number;
  clampLoadN: number;
}

export interface JointAnalysis {
  coreVersion: string;
  schemaVersion: 1;
  designName: string;
  units: JointDesign["units"];
  summary: {
    governingEstimator: "cone" | "beam";
    minGasketStressMpa: number;
    maxGasketStressMpa: number;
    meanGasketStressMpa: number;
    failCount: number;
    warnCount: number;
    passCount: number;
  };
  fastener: {
    threadId: string;
    nominalDiameterMm: number;
    tensileStressAreaMm2: number;
    rootAreaMm2: number;
    materialId: string;
    materialName: string;
    yieldMpa: number;
    tensileMpa: number;
    proofMpa: number;
    proofEstimated: boolean;
    allowableMpa: number | null;
    nutAcrossFlatsMm: number | null;
    nutAcrossCornersMm: number | null;
    threadLengthMm: number;
  };
  stiffness: {
    gripMm: number;
    shankInGripMm: number;
    threadInGripMm: number;
    boltStiffnessNPerMm: number;
    memberStiffnessNPerMm: number;
    gasketSpringNPerMm: number | null;
    jointConstant: number;
    bearingDiameterMm: number;
    frusta: {
      layerIndex: number;
      thicknessMm: number;
      narrowDiameterMm: number;
      modulusMpa: number;
      stiffnessNPerMm: number;
    }[];
    /** Which model gave km (frusta, or the beam on an elastic foundation when it governs). */
    memberStiffnessBasis: string;
    washerActsAs: "rigid" | "flexible";
    holeDiameterMm: number;
    /** Shown only where its assumptions hold (hole = d, bearing 1.5·d, rigid, one material). */
    wileman: JointModel["wileman"];
  };
  preload: {
    rule: string;
    targetN: number;
    minN: number;
    maxN: number;
    scatter: number;
    scatterSource: string;
    targetStressMpa: number;
    targetTorqueNmm: number;
    nutFactor: number;
    nutFactorSource: string;
  };
  loads: {
    pressureAreaMm2: number;
    pressureAreaBasis: string;
    totalExternalN: number;
    maxExternalPerBoltN: number;
    separationLoadAtMinPreloadN: number;
    factors: { yieldFactor: number; loadFactor: number | null; separationFactor: number | null };
  };
  estimator: {
    governing: "cone" | "beam";
    requested: "auto" | "cone" | "beam";
    reason: string;
    coneAngleDeg: number;
    coneAngleMode: "thickness-dependent" | "fixed";
    coneRule: string;
    coneDepthMm: number;
    coneRadiusMm: number;
    /** How rc and the footprint's pressure shape were found (calibrated on FE, or the fixed cone). */
    footprintRule: string;
    footprintShape: { a: number; b: number };
    lambdaPerMm: number;
    beamSpreadMm: number;
    spreadRatio: number;
    flexuralRigidityNmm2: number;
    foundationModulusMpa: number;
    stripWidthMm: number;
    samplesPerPitch: number;
  };
  gasketStress: {
    governing: "cone" | "beam";
    pathLengthMm: number;
    pathKind: "gasket-centre-line" | "bolt-path";
    minMpa: number;
    maxMpa: number;
    meanMpa: number;
    seatingMpa: number;
    crushMpa: number | null;
    boltSOnPathMm: number[];
    cone: ProfileSummary & { missesGasket: boolean };
    beam: ProfileSummary & {
      liftedLengthMm: number;
      iterations: number;
      converged: boolean;
      solverNodes: number;
      forceBalanceRatio: number;
    };
    /** Stress at target preload; scale by preload.minN/targetN or maxN/targetN for the window. */
    profile: {
      sMm: number[];
      xMm: number[];
      yMm: number[];
      stressMpa: number[];
      coneMpa: number[];
      beamMpa: number[];
      onGasket: boolean[];
    };
  };
  asmeAppendix2: AsmeAppendix2Result;
  /** Appendix 2 flange stresses and rigidity, UG-34 cover thickness, UG-99 test pressure suggestion. */
  flangeDesign: FlangeDesignResult;
  bolts: BoltResult[];
  checks: (CheckRecord & { boltIds: string[] })[];
  assemblyPlan: AssemblyPlan;
  assumptions: string[];
  warnings: string[];
  catalogueEditions: CatalogueEdition[];
}

/**
 * Analyses a design. Throws a DesignRefusedError, and returns no numbers, for a design that
 * `validateJointDesign` rejects and for results whose own force balance is off by more than 0.5 %.
 */
export function analyzeJoint(design: JointDesign): JointAnalysis {
  const issues = validateJointDesign(design);
  if (issues.length > 0) throw new DesignRefusedError(issues);
  const model = buildJointModel(design);
  const { profiles, gov } = balancedProfiles(model);
  const p = model.preload;
  const C = model.jointConstant;
  const d = model.nominalDiameterMm;
  const torqueNmm = torqueFromPreloadNmm(design.assembly.nutFactor.value, p.targetN, d);
  const spacing = new Map(getNeighbourSpacings(design).map((s) => [s.fromId, s]));
  const bolts: BoltResult[] = design.bolts.map((b, i) => {
    const ext = model.externalLoadPerBoltN[i];
    const share = shareExternalLoad(p.targetN, Math.max(ext, 0), C);
    const sp = spacing.get(b.id);
    return {
      id: b.id,
      sMm: b.sMm,
      xMm: model.boltPoints[i].x,
      yMm: model.boltPoints[i].y,
      pitchToNextMm: sp?.pitchMm ?? null,
      chordToNextMm: sp?.chordMm ?? null,
      preloadTargetN: p.targetN,
      preloadMinN: p.minN,
      preloadMaxN: p.maxN,
      torqueNmm,
      externalLoadN: ext,
      boltLoadN: share.boltN,
      clampLoadN: share.clampN,
    };
  });
  const maxExt = Math.max(0, ...model.externalLoadPerBoltN);
  const proofLoadN = p.proofMpa * model.thread.tensileStressAreaMm2;
  const asme = computeAsmeAppendix2(model);
  const flange = computeFlangeDesign(model, asme.result);
  const checks: CheckRecord[] = [
    ...checkGasketStress(model, gov.summary, gov.estimator),
    ...asme.checks,
    ...flange.checks,
    ...checkBolts(model),
    ...checkSpacing(model, gov.estimator === "cone"),
    ...checkEdgesAndPattern(model),
  ];
  const gm = design.gasket.material;
  const warnings: string[] = [];
  if (!profiles.beamInfo.converged)
    warnings.push(
      "Tensionless beam contact did not settle within 60 iterations; the last contact set is shown.",
    );
  if (profiles.beam.unloadedLengthMm > 0 && gov.estimator === "beam")
    warnings.push(
      `The flange lifts off the gasket over ${profiles.beam.unloadedLengthMm.toFixed(1)} mm of the path at target preload (beam estimate).`,
    );
  if (profiles.cone.unloadedLengthMm > 0 && gov.estimator === "cone")
    warnings.push(
      `Cone footprints leave ${profiles.cone.unloadedLengthMm.toFixed(1)} mm of the gasket path unloaded.`,
    );
  const assumptions = [
    ...model.notes,
    `Cone half-angle for member stiffness ${model.coneAngleDeg.toFixed(2)}°: ${model.coneAngleRule}.`,
    `Footprint at the gasket plane, rc = ${model.coneRadiusMm.toFixed(1)} mm: ${model.footprintRule}.`,
    `Gasket stress estimators: ${profiles.choice.reason}.`,
    `Beam on elastic foundation: flange strip ${model.region.stripWidthMm.toFixed(1)} mm wide, flanges on both sides of the gasket in series (1/EI = Σ 1/EIi), foundation k = Eg·wg/tg; solved by finite differences on the closed path with tensionless contact.`,
    `Gasket stress sampled at ${design.estimator.samplesPerPitch} points per bolt pitch along the ${model.region.kind === "full-face" ? "bolt path (full-face gasket)" : "gasket centre line"}.`,
    `External load per bolt: pressure on ${model.pressureAreaBasis}, plus axial load shared equally and moment in proportion to y.`,
    "Tensile stress area for bolt stress, preload and torque; root area for ASME Appendix 2 Ab.",
    "Flange and cover design rules are code-specific: the flange checks apply ASME VIII-1 Appendix 2 and UG-34 as entered, and a competent engineer signs the flange design off.",
    "Results are engineering estimates: design to the governing code; gasket factors are design values, not assembly targets, and the gasket manufacturer's data supersede them; torque controls preload only indirectly; pressure-boundary joints need review by a competent engineer.",
  ];
  const counts = countChecks(checks);
  const arr = (a: ArrayLike<number>): number[] => {
    const out = new Array<number>(a.length);
    for (let i = 0; i < a.length; i++) out[i] = a[i];
    return out;
  };
  const L = model.boltPath.lengthMm;
  const byLabel = design.bolts
    .map((b, i) => ({ id: b.id, s: ((b.sMm % L) + L) % L, p: model.boltPoints[i] }))
    .sort((a, b) => a.s - b.s);
  const result: JointAnalysis = {
    coreVersion: CORE_VERSION,
    schemaVersion: 1,
    designName: design.name,
    units: design.units,
    summary: {
      governingEstimator: gov.estimator,
      minGasketStressMpa: gov.summary.minMpa,
      maxGasketStressMpa: gov.summary.maxMpa,
      meanGasketStressMpa: gov.summary.meanMpa,
      ...counts,
    },
    fastener: {
      threadId: model.thread.id,
      nominalDiameterMm: d,
      tensileStressAreaMm2: model.thread.tensileStressAreaMm2,
      rootAreaMm2: model.thread.rootAreaMm2,
      materialId: model.material.id,
      materialName: model.material.name,
      yieldMpa: model.strength.yieldMpa,
      tensileMpa: model.strength.tensileMpa,
      proofMpa: p.proofMpa,
      proofEstimated: p.proofEstimated,
      allowableMpa: model.strength.allowableMpa,
      nutAcrossFlatsMm: model.nut?.acrossFlatsMm ?? null,
      nutAcrossCornersMm: model.nut?.acrossCornersMm ?? null,
      threadLengthMm: model.threadLengthMm,
    },
    stiffness: {
      gripMm: model.gripMm,
      shankInGripMm: model.shankInGripMm,
      threadInGripMm: model.threadInGripMm,
      boltStiffnessNPerMm: model.boltStiffnessNPerMm,
      memberStiffnessNPerMm: model.memberStiffnessNPerMm,
      gasketSpringNPerMm: model.gasketSpringNPerMm,
      jointConstant: C,
      bearingDiameterMm: model.bearingDiameterMm,
      frusta: model.frusta,
      memberStiffnessBasis: model.memberStiffnessBasis,
      washerActsAs: model.washerActsAs,
      holeDiameterMm: model.holeDiameterMm,
      wileman: model.wileman,
    },
    preload: {
      rule: p.rule,
      targetN: p.targetN,
      minN: p.minN,
      maxN: p.maxN,
      scatter: p.scatter,
      scatterSource: p.scatterSource,
      targetStressMpa: p.targetN / model.thread.tensileStressAreaMm2,
      targetTorqueNmm: torqueNmm,
      nutFactor: design.assembly.nutFactor.value,
      nutFactorSource: design.assembly.nutFactor.source,
    },
    loads: {
      pressureAreaMm2: model.pressureAreaMm2,
      pressureAreaBasis: model.pressureAreaBasis,
      totalExternalN: model.externalLoadPerBoltN.reduce((a, v) => a + v, 0),
      maxExternalPerBoltN: maxExt,
      separationLoadAtMinPreloadN: p.minN / (1 - C),
      factors: computeSafetyFactors(proofLoadN, p.targetN, maxExt, C),
    },
    estimator: {
      governing: gov.estimator,
      requested: design.estimator.estimator,
      reason: profiles.choice.reason,
      coneAngleDeg: model.coneAngleDeg,
      coneAngleMode: design.estimator.coneAngle.mode,
      coneRule: model.coneAngleRule,
      coneDepthMm: model.coneDepthMm,
      coneRadiusMm: model.coneRadiusMm,
      footprintRule: model.footprintRule,
      footprintShape: { a: model.footprintShape.a, b: model.footprintShape.b },
      lambdaPerMm: model.lambdaPerMm,
      beamSpreadMm: profiles.choice.beamSpreadMm,
      spreadRatio: profiles.choice.spreadRatio,
      flexuralRigidityNmm2: model.flexuralRigidityNmm2,
      foundationModulusMpa: model.foundationModulusMpa,
      stripWidthMm: model.region.stripWidthMm,
      samplesPerPitch: design.estimator.samplesPerPitch,
    },
    gasketStress: {
      governing: gov.estimator,
      pathLengthMm: profiles.pathLengthMm,
      pathKind: model.region.kind === "full-face" ? "bolt-path" : "gasket-centre-line",
      minMpa: gov.summary.minMpa,
      maxMpa: gov.summary.maxMpa,
      meanMpa: gov.summary.meanMpa,
      seatingMpa: gm.qMinMpa ?? gm.yMpa,
      crushMpa: gm.qsMaxMpa ?? null,
      boltSOnPathMm: profiles.boltSOnPathMm,
      cone: { ...profiles.cone, missesGasket: profiles.coneMisses },
      beam: { ...profiles.beam, ...profiles.beamInfo },
      profile: profileArrays(profiles, arr),
    },
    asmeAppendix2: asme.result,
    flangeDesign: flange.result,
    bolts,
    checks: checks.map((c) => ({ ...c, boltIds: c.subject ?? [] })),
    assemblyPlan: buildAssemblyPlan({
      boltIds: byLabel.map((x) => x.id),
      points: byLabel.map((x) => x.p),
      targetPreloadN: p.targetN,
      nutFactor: design.assembly.nutFactor.value,
      nutFactorSource: design.assembly.nutFactor.source,
      nominalDiameterMm: d,
    }),
    assumptions,
    warnings,
    catalogueEditions: collectCatalogueEditions(model),
  };
  const { value, replaced } = toFiniteJson(result);
  if (replaced > 0) value.warnings.push(`${replaced} non-finite intermediate values were replaced by null.`);
  return value;
}
