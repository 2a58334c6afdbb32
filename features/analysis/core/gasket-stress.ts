/**
 * Gasket stress along the gasket path by both estimators (cone superposition; flange as a beam
 * on an elastic foundation), with the summary of each and the choice of the governing one.
 * Computed at the target preload; the solution is linear in the bolt forces (the tensionless
 * contact set does not change under uniform scaling), so minimum/maximum preload results are
 * scaled copies. Units: mm, N, MPa.
 */
import type { JointDesign } from "./design";
import type { JointModel } from "./joint-model";
import { projectOntoPath, samplePathUniform } from "./path";
import { isOnGasket } from "./gasket-region";
import { solveBeamOnFoundation } from "./beam-foundation";
import { buildConeField, coneMissesGasket, conePressuresInto, type ConeField } from "./cone-superposition";
import { onGasketFlags } from "./finite-json";
import { chooseEstimator, type EstimatorChoice, type EstimatorName } from "./estimator-choice";
import { DesignRefusedError } from "./validate";

export interface ProfileSummary {
  minMpa: number;
  maxMpa: number;
  meanMpa: number;
  minAt: { sMm: number; xMm: number; yMm: number };
  maxAt: { sMm: number; xMm: number; yMm: number };
  /** Length of path on gasket material that carries no stress, mm. */
  unloadedLengthMm: number;
}

export interface GasketStressProfiles {
  pathLengthMm: number;
  sampleCount: number;
  sMm: Float64Array;
  xMm: Float64Array;
  yMm: Float64Array;
  /** 1 where the sample lies on gasket material (0 inside a bolt hole on a full-face path). */
  onGasket: Uint8Array;
  coneMpa: Float64Array;
  beamMpa: Float64Array;
  cone: ProfileSummary;
  beam: ProfileSummary;
  choice: EstimatorChoice;
  coneField: ConeField;
  coneMisses: boolean;
  beamInfo: {
    solverNodes: number;
    iterations: number;
    converged: boolean;
    liftedLengthMm: number;
    forceBalanceRatio: number;
  };
  /** Bolt positions projected onto the gasket path, mm. */
  boltSOnPathMm: number[];
  totalForceN: number;
}

/** True for circular flanges with equally pitched bolts on a centred circle (all footprints alike). */
export function isRegularCircularPattern(design: JointDesign): boolean {
  if (design.outline.kind !== "circle" || design.boltPath.kind !== "circle") return false;
  if (design.bore && design.bore.kind !== "circle") return false;
  if (design.gasket.kind === "ring" && design.gasket.geometry.kind !== "annulus") return false;
  const L = Math.PI * design.boltPath.diameterMm;
  const n = design.bolts.length;
  const s = design.bolts.map((b) => ((b.sMm % L) + L) % L).sort((a, b) => a - b);
  const p = L / n;
  return (
    design.bolts.every((b) => !b.offPathMm) &&
    s.every((v, i) => Math.abs(((v - s[0] - i * p + L / 2) % L) - L / 2) < 1e-6 * p)
  );
}

function summarise(
  values: Float64Array,
  s: Float64Array,
  x: Float64Array,
  y: Float64Array,
  on: Uint8Array,
  step: number,
): ProfileSummary {
  let min = Infinity,
    max = -Infinity,
    sum = 0,
    count = 0,
    iMin = 0,
    iMax = 0,
    unloaded = 0;
  for (let i = 0; i < values.length; i++) {
    if (!on[i]) continue;
    const v = values[i];
    sum += v;
    count++;
    if (v < min) {
      min = v;
      iMin = i;
    }
    if (v > max) {
      max = v;
      iMax = i;
    }
  }
  const tol = Math.max(max, 0) * 1e-9;
  for (let i = 0; i < values.length; i++) if (on[i] && values[i] <= tol) unloaded += step;
  if (count === 0) {
    min = 0;
    max = 0;
  }
  return {
    minMpa: min,
    maxMpa: max,
    meanMpa: count ? sum / count : 0,
    minAt: { sMm: s[iMin], xMm: x[iMin], yMm: y[iMin] },
    maxAt: { sMm: s[iMax], xMm: x[iMax], yMm: y[iMax] },
    unloadedLengthMm: unloaded,
  };
}

/** Both estimates along the gasket path for bolt forces `forcesN` (default: the target preload on every bolt). */
export function computeGasketStressProfiles(model: JointModel, forcesN?: number[]): GasketStressProfiles {
  const design = model.design;
  const region = model.region;
  const path = region.path;
  const L = path.lengthMm;
  const n = model.boltPoints.length;
  const forces = forcesN ?? model.boltPoints.map(() => model.preload.targetN);
  const total = forces.reduce((a, f) => a + f, 0);
  const N = n * design.estimator.samplesPerPitch;
  const step = L / N;
  const sMm = new Float64Array(N),
    xMm = new Float64Array(N),
    yMm = new Float64Array(N);
  const onGasket = new Uint8Array(N);
  const fullFace = region.kind === "full-face";
  samplePathUniform(path, N, xMm, yMm);
  for (let j = 0; j < N; j++) {
    sMm[j] = j * step;
    onGasket[j] = fullFace ? (isOnGasket(region, xMm[j], yMm[j]) ? 1 : 0) : 1;
  }

  // Beam on elastic foundation along the path, solved on a grid fine enough for λ·h ≤ 0.05.
  const boltSOnPathMm = model.boltPoints.map((p) => projectOntoPath(path, p).sMm);
  // A whole number of solver nodes per bolt keeps a regular pattern exactly periodic.
  const perBolt = Math.min(
    design.estimator.samplesPerPitch,
    Math.max(8, Math.ceil((model.lambdaPerMm * L) / 0.05 / n)),
  );
  const solverNodes = Math.max(perBolt * n, 16);
  const sol = solveBeamOnFoundation({
    pathLengthMm: L,
    nodes: solverNodes,
    loads: boltSOnPathMm.map((s, i) => ({ sMm: s, forceN: forces[i] })),
    flexuralRigidityNmm2: model.flexuralRigidityNmm2,
    foundationModulusMpa: model.foundationModulusMpa,
  });
  const beamMpa = new Float64Array(N);
  const hs = L / solverNodes;
  const wg = region.foundationWidthMm;
  let beamForce = 0;
  const lineLoad = sol.lineLoadNPerMm;
  for (let j = 0; j < N; j++) {
    const u = sMm[j] / hs;
    const fl = Math.floor(u);
    // fl % solverNodes and (i0 + 1) % solverNodes without the floating-point remainder (fl ≥ 0).
    const i0 = fl < solverNodes ? fl : fl % solverNodes;
    const i1 = i0 + 1 < solverNodes ? i0 + 1 : 0;
    const fr = u - fl;
    const line = lineLoad[i0] * (1 - fr) + lineLoad[i1] * fr;
    beamMpa[j] = line / wg;
    beamForce += line * step;
  }

  // Cone superposition at the gasket plane.
  const field = buildConeField(
    region,
    forces,
    region.holeRadiusMm,
    model.coneRadiusMm,
    isRegularCircularPattern(design),
    model.footprintShape,
  );
  const misses = coneMissesGasket(field);
  const coneMpa = new Float64Array(N);
  if (!misses) conePressuresInto(field, xMm, yMm, onGasket, coneMpa);

  const choice = chooseEstimator({
    requested: design.estimator.estimator,
    lambdaPerMm: model.lambdaPerMm,
    coneRadiusMm: model.coneRadiusMm,
    coneMissesGasket: misses,
  });
  return {
    pathLengthMm: L,
    sampleCount: N,
    sMm,
    xMm,
    yMm,
    onGasket,
    coneMpa,
    beamMpa,
    cone: summarise(coneMpa, sMm, xMm, yMm, onGasket, step),
    beam: summarise(beamMpa, sMm, xMm, yMm, onGasket, step),
    choice,
    coneField: field,
    coneMisses: misses,
    beamInfo: {
      solverNodes,
      iterations: sol.iterations,
      converged: sol.converged,
      liftedLengthMm: sol.liftedLengthMm,
      forceBalanceRatio: total > 0 ? beamForce / total : 1,
    },
    boltSOnPathMm,
    totalForceN: total,
  };
}

/** The governing profile's values. */
export function governingProfile(p: GasketStressProfiles): {
  estimator: EstimatorName;
  values: Float64Array;
  summary: ProfileSummary;
} {
  return p.choice.estimator === "cone"
    ? { estimator: "cone", values: p.coneMpa, summary: p.cone }
    : { estimator: "beam", values: p.beamMpa, summary: p.beam };
}

/**
 * The profiles along the path as a result carries them: plain arrays, each written by `copy` (the
 * result's copy, or the preview's that writes null for a non-finite value), the governing values
 * as `stressMpa`.
 */
export function profileArrays(p: GasketStressProfiles, copy: (a: ArrayLike<number>) => number[]) {
  return {
    sMm: copy(p.sMm),
    xMm: copy(p.xMm),
    yMm: copy(p.yMm),
    stressMpa: copy(governingProfile(p).values),
    coneMpa: copy(p.coneMpa),
    beamMpa: copy(p.beamMpa),
    onGasket: onGasketFlags(p.onGasket),
  };
}

/** Largest relative difference between the beam estimate's gasket force and the bolt forces. */
export const FORCE_BALANCE_TOLERANCE = 0.005;

/**
 * The beam estimate integrates to Σ Fi by construction; when the inputs are outside what the
 * solver resolves (a gasket modulus of 1e300 or 1e-300 MPa) it does not, and its numbers mean
 * nothing. Returns the refusal for such profiles, null when the balance holds within 0.5 %.
 */
export function forceBalanceIssue(
  p: Pick<GasketStressProfiles, "beamInfo" | "totalForceN">,
): { path: string; message: string } | null {
  const ratio = p.beamInfo.forceBalanceRatio;
  if (Number.isFinite(ratio) && Math.abs(ratio - 1) <= FORCE_BALANCE_TOLERANCE) return null;
  const off = Number.isFinite(ratio) ? `${(ratio * 100).toPrecision(4)} % of` : "not comparable with";
  return {
    path: "design",
    message: `the beam estimate's gasket force is ${off} the bolt forces (${p.totalForceN.toPrecision(4)} N), more than ${FORCE_BALANCE_TOLERANCE * 100} % off; the inputs lie outside what the solver resolves (check the gasket modulus and thickness and the flange thicknesses and moduli), so no numbers are returned`,
  };
}

/**
 * The model's profiles and the governing one, as `analyzeJoint` and `previewJoint` both start:
 * throws a DesignRefusedError ("results refused", no numbers) when `forceBalanceIssue` finds one.
 */
export function balancedProfiles(model: JointModel): {
  profiles: GasketStressProfiles;
  gov: ReturnType<typeof governingProfile>;
} {
  const profiles = computeGasketStressProfiles(model);
  const imbalance = forceBalanceIssue(profiles);
  if (imbalance) throw new DesignRefusedError([imbalance], "results refused");
  return { profiles, gov: governingProfile(profiles) };
}
