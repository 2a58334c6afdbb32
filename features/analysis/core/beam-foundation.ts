/**
 * The flange as a beam on an elastic (Winkler) foundation along a closed gasket path, loaded by
 * the bolt forces. Hetényi's infinite-beam solution, superposed periodically, is the reference;
 * the solver discretises the closed beam by finite differences (EI·w'''' + k·w = q, periodic),
 * which converges to that superposition, and which also solves the tensionless case: where the
 * flange would pull on the gasket the foundation is removed and the system solved again until
 * the contact set stops changing. The gasket never carries tension.
 * Units: N, mm, MPa; k is the foundation modulus per unit path length (N/mm per mm of deflection).
 */
import * as fm from "./fixed-math";

/** λ = (k / 4EI)^¼, 1/mm. Example: k = 2000 MPa, EI = 1e10 N·mm² → 0.0150 /mm. */
export function foundationLambdaPerMm(foundationModulusMpa: number, flexuralRigidityNmm2: number): number {
  return fm.pow(foundationModulusMpa / (4 * flexuralRigidityNmm2), 0.25);
}

/**
 * Hetényi (1946) infinite beam under a point load F: w(x) = (F·λ/2k)·e^(−λ|x|)·(cos λ|x| + sin λ|x|).
 * Example: F = 10 kN, k = 2000, λ = 0.02, x = 0 → 0.05 mm.
 */
export function hetenyiDeflectionMm(
  forceN: number,
  foundationModulusMpa: number,
  lambdaPerMm: number,
  xMm: number,
): number {
  const lx = lambdaPerMm * Math.abs(xMm);
  return ((forceN * lambdaPerMm) / (2 * foundationModulusMpa)) * fm.exp(-lx) * (fm.cos(lx) + fm.sin(lx));
}

/**
 * Deflection under one of equal loads F at equal spacing p on an infinite beam, per newton:
 * w/F = (λ/2k)·(sinh λp + sin λp)/(cosh λp − cos λp) [calc: the sum over all loads of Hetényi's
 * point-load solution]. Limits: 1/(k·p) for λp → 0 (the load spread evenly over the pitch),
 * λ/(2k) for a single load. Example: λ = 0.02, k = 2000, p = 100 → 5.43e-6 mm/N.
 */
export function periodicBeamCompliancePerN(
  lambdaPerMm: number,
  foundationModulusMpa: number,
  pitchMm: number,
): number {
  const lp = lambdaPerMm * pitchMm;
  const single = lambdaPerMm / (2 * foundationModulusMpa);
  if (lp > 30) return single;
  if (lp < 1e-4) return 1 / (foundationModulusMpa * pitchMm);
  // sinh and cosh from exp (already used by the solver), for the same bits in every engine.
  const e = fm.exp(lp);
  const sinh = (e - 1 / e) / 2;
  const cosh = (e + 1 / e) / 2;
  return (single * (sinh + fm.sin(lp))) / (cosh - fm.cos(lp));
}

/** Periodic superposition of Hetényi's solution on a closed path of length L (images until negligible). */
export function hetenyiPeriodicDeflectionMm(
  loads: { sMm: number; forceN: number }[],
  pathLengthMm: number,
  foundationModulusMpa: number,
  lambdaPerMm: number,
  sMm: number,
): number {
  const images = Math.ceil(20 / (lambdaPerMm * pathLengthMm)) + 1;
  let w = 0;
  for (const l of loads) {
    for (let j = -images; j <= images; j++)
      w += hetenyiDeflectionMm(l.forceN, foundationModulusMpa, lambdaPerMm, sMm - l.sMm + j * pathLengthMm);
  }
  return w;
}

export interface BeamSolution {
  /** Relative approach of the flanges at each node (negative where lifted off), mm. */
  deflectionMm: Float64Array;
  /** Foundation force per unit length at each node, N/mm (zero where lifted). */
  lineLoadNPerMm: Float64Array;
  contact: Uint8Array;
  iterations: number;
  converged: boolean;
  liftedLengthMm: number;
}

/**
 * Solves EI·w'''' + k·max(w, 0) = Σ Fi·δ(s − si) on a closed path of `nodes` equal steps.
 * Loads between nodes are shared linearly by the two neighbours. Force balance holds exactly:
 * Σ k·w·h over the contact nodes = Σ Fi.
 * Example: 8 equal loads, λ·pitch ≈ 1 → a peak under each bolt, a minimum mid-span, no lift-off.
 */
export function solveBeamOnFoundation(input: {
  pathLengthMm: number;
  nodes: number;
  loads: { sMm: number; forceN: number }[];
  flexuralRigidityNmm2: number;
  foundationModulusMpa: number;
}): BeamSolution {
  const N = input.nodes;
  const h = input.pathLengthMm / N;
  const a = input.flexuralRigidityNmm2 / (h * h * h * h);
  const k = input.foundationModulusMpa;
  const q = new Float64Array(N);
  for (const l of input.loads) {
    const u = (((l.sMm % input.pathLengthMm) + input.pathLengthMm) % input.pathLengthMm) / h;
    const i0 = Math.floor(u) % N;
    const fr = u - Math.floor(u);
    q[i0] += (l.forceN * (1 - fr)) / h;
    q[(i0 + 1) % N] += (l.forceN * fr) / h;
  }
  const pos = zigZagPositions(N);
  const rhs = new Float64Array(N);
  const w = new Float64Array(N);
  const contact = new Uint8Array(N).fill(1);
  let iterations = 0;
  let converged = false;
  let band: Float64Array | null = null;
  while (iterations < 60) {
    iterations++;
    // Every node in contact: the matrix depends on N, EI/h⁴ and k only, so its factor is reused
    // from an earlier call when only the loads changed (a bolt dragged, another preload).
    let factor: Float64Array;
    if (iterations === 1) factor = fullContactFactor(N, a, k, pos, contact);
    else {
      band ??= new Float64Array(N * BAND_W);
      assembleBand(band, N, a, k, pos, contact);
      choleskyBandFactor(band, N, BAND_P);
      factor = band;
    }
    for (let i = 0; i < N; i++) rhs[pos[i]] = q[i];
    choleskyBandSubstitute(factor, rhs, N, BAND_P);
    let changed = false;
    for (let i = 0; i < N; i++) {
      w[i] = rhs[pos[i]];
      const c = w[i] > 0 ? 1 : 0;
      if (c !== contact[i]) {
        contact[i] = c;
        changed = true;
      }
    }
    if (!changed) {
      converged = true;
      break;
    }
  }
  const lineLoadNPerMm = new Float64Array(N);
  let lifted = 0;
  for (let i = 0; i < N; i++) {
    if (contact[i] && w[i] > 0) lineLoadNPerMm[i] = k * w[i];
    else lifted += h;
  }
  return { deflectionMm: w, lineLoadNPerMm, contact, iterations, converged, liftedLengthMm: lifted };
}

const BAND_P = 4;
const BAND_W = BAND_P + 1;
const STENCIL = [1, -4, 6, -4, 1];
const MEMO_LIMIT = 16;
const positionMemo = new Map<number, Int32Array>();
const factorMemo = new Map<string, Float64Array>();

/**
 * Zig-zag ordering 0, N−1, 1, N−2, … turns the cyclic pentadiagonal matrix into a band of
 * half-width 4; `pos[node]` is the node's row in the band.
 */
function zigZagPositions(N: number): Int32Array {
  let pos = positionMemo.get(N);
  if (!pos) {
    const order = new Int32Array(N);
    pos = new Int32Array(N);
    for (let j = 0, lo = 0, hi = N - 1; j < N; j++) order[j] = j % 2 === 0 ? lo++ : hi--;
    for (let j = 0; j < N; j++) pos[order[j]] = j;
    if (positionMemo.size >= MEMO_LIMIT) positionMemo.clear();
    positionMemo.set(N, pos);
  }
  return pos;
}

/** The periodic five-point stencil times EI/h⁴, plus k on the contact nodes, as a band (row i holds A[i][i − j]). */
function assembleBand(
  band: Float64Array,
  N: number,
  a: number,
  k: number,
  pos: Int32Array,
  contact: Uint8Array,
): void {
  band.fill(0);
  for (let i = 0; i < N; i++) {
    const pi = pos[i];
    for (let o = -2; o <= 2; o++) {
      const j = (i + o + N) % N;
      const pj = pos[j];
      if (pj > pi) continue;
      band[pi * BAND_W + (pi - pj)] += a * STENCIL[o + 2];
    }
    if (contact[i]) band[pi * BAND_W] += k;
  }
}

/** The Cholesky factor of the all-contact matrix, from the memo when N, a and k were seen before (never written to by callers). */
function fullContactFactor(
  N: number,
  a: number,
  k: number,
  pos: Int32Array,
  contact: Uint8Array,
): Float64Array {
  const key = `${N}|${a}|${k}`;
  let f = factorMemo.get(key);
  if (!f) {
    f = new Float64Array(N * BAND_W);
    assembleBand(f, N, a, k, pos, contact);
    choleskyBandFactor(f, N, BAND_P);
    if (factorMemo.size >= MEMO_LIMIT) factorMemo.clear();
    factorMemo.set(key, f);
  }
  return f;
}

/** In-place Cholesky factorisation A = L·Lᵀ of a symmetric positive-definite band matrix (row i holds A[i][i − j], j = 0…p). */
function choleskyBandFactor(band: Float64Array, n: number, p: number): void {
  const W = p + 1;
  for (let i = 0; i < n; i++) {
    const j0 = Math.max(0, i - p);
    for (let j = j0; j <= i; j++) {
      let sum = band[i * W + (i - j)];
      const k0 = Math.max(j0, j - p);
      for (let k = k0; k < j; k++) sum -= band[i * W + (i - k)] * band[j * W + (j - k)];
      if (i === j) band[i * W] = Math.sqrt(Math.max(sum, 1e-300));
      else band[i * W + (i - j)] = sum / band[j * W];
    }
  }
}

/** Solves L·Lᵀ·x = b in place with the factor from choleskyBandFactor. */
function choleskyBandSubstitute(band: Float64Array, b: Float64Array, n: number, p: number): void {
  const W = p + 1;
  for (let i = 0; i < n; i++) {
    let sum = b[i];
    for (let k = Math.max(0, i - p); k < i; k++) sum -= band[i * W + (i - k)] * b[k];
    b[i] = sum / band[i * W];
  }
  for (let i = n - 1; i >= 0; i--) {
    let sum = b[i];
    for (let k = i + 1; k <= Math.min(n - 1, i + p); k++) sum -= band[k * W + (k - i)] * b[k];
    b[i] = sum / band[i * W];
  }
}
