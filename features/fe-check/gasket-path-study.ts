/**
 * Gasket path check solved with Gmsh and CalculiX (FE cross-check, model 2). `solveGasketPath`
 * meshes a plate problem, refuses a mesh over the element cap before any solver run, and runs
 * the active-set loop (as model 1: closed gasket cells that pull open, open cells that penetrate
 * close, until no cell changes); `runGasketPathCheck` maps a design to the problem
 * (`gasket-path-joint.ts`), solves it and samples the FE gasket stress along the estimate's path.
 * Every run is in its own temporary folder, removed afterwards; an AbortSignal kills the running
 * process and rejects with CcxCancelled; nothing is returned from a run that did not finish.
 * Server-side (spawns gmsh and ccx).
 */
import type { JointDesign } from "@/features/analysis/core/design";
import { CcxError, runCcxAsync } from "./ccx-runner";
import { runGmshAsync } from "./gmsh-runner";
import { FeInputError } from "./joint-stack";
import {
  buildGasketPathMesh,
  parseMsh22,
  writeGasketPathDeck,
  writePlanformGeo,
  type GasketPathMesh,
  type GasketPathProblem,
} from "./gasket-path-model";
import {
  approachAt,
  gasketCellLocator,
  gasketForceN,
  pressureAtMpa,
  readGasketPathRun,
  updateGasketContact,
  type CellLocator,
} from "./gasket-path-result";
import {
  estimateAtMinimumPreload,
  GASKET_PATH_ELEMENT_CAP,
  planGasketPath,
  type GasketPathModelKind,
} from "./gasket-path-joint";

export interface GasketPathProgressInfo {
  elements?: number;
  solverSeconds?: number;
}

export interface GasketPathOptions {
  /** Stages: "meshing", "solving" (after each linear run, with elements and solver seconds so far), "sampling". */
  onProgress?(stage: string, info: GasketPathProgressInfo): void;
  signal?: AbortSignal;
  /** Most elements (plate + gasket cells); default GASKET_PATH_ELEMENT_CAP. */
  elementCap?: number;
  /** Element size divisor (1 = the default mesh, 1.5 = the refined level of the convergence check). */
  refine?: number;
  /** Time limit of each Gmsh or CalculiX process, ms (default 10 min). */
  processTimeoutMs?: number;
}

export interface GasketPathSolution {
  mesh: GasketPathMesh;
  locator: CellLocator;
  closed: Uint8Array;
  uz: Float64Array;
  /** Applied bolt loads, the fixed face's reaction and the closed cells' integrated force, N. */
  appliedN: number;
  reactionN: number;
  gasketForceN: number;
  linearRuns: number;
  solverSeconds: number;
}

const MAX_RUNS = 40;

export async function solveGasketPath(
  problem: GasketPathProblem,
  opts: GasketPathOptions = {},
): Promise<GasketPathSolution> {
  const timeoutMs = opts.processTimeoutMs ?? 600_000;
  opts.onProgress?.("meshing", {});
  const msh = await runGmshAsync(writePlanformGeo(problem.planform), { signal: opts.signal, timeoutMs });
  const mesh = buildGasketPathMesh(parseMsh22(msh), problem);
  const cap = opts.elementCap ?? GASKET_PATH_ELEMENT_CAP;
  if (mesh.elementCount > cap)
    throw new FeInputError(
      `The gasket path mesh has ${mesh.elementCount} elements, over the cap of ${cap}; nothing was solved (use a coarser mesh or raise the cap).`,
    );
  if (!mesh.gasketCells.length) throw new FeInputError("The gasket path mesh has no cell on the gasket.");
  const k = problem.gasket.modulusMpa / problem.gasket.thicknessMm;
  const applied = problem.loads.reduce((a, l) => a + l.forceN, 0);
  let gasketArea = 0;
  for (const e of mesh.gasketCells) gasketArea += mesh.areaMm2[e];
  const tolMm = (1e-6 * applied) / gasketArea / k;
  let closed: Uint8Array = new Uint8Array(mesh.gasketCells.length).fill(1);
  let solverSeconds = 0;
  opts.onProgress?.("solving", { elements: mesh.elementCount, solverSeconds: 0 });
  for (let run = 1; run <= MAX_RUNS; run++) {
    const t0 = performance.now();
    const dat = await runCcxAsync(writeGasketPathDeck(mesh, problem, closed), {
      signal: opts.signal,
      timeoutMs,
    });
    solverSeconds += (performance.now() - t0) / 1000;
    opts.onProgress?.("solving", { elements: mesh.elementCount, solverSeconds });
    const res = readGasketPathRun(mesh, dat);
    const upd = updateGasketContact(mesh, res.uz, closed, tolMm);
    if (upd.changed === 0)
      return {
        mesh,
        locator: gasketCellLocator(mesh),
        closed,
        uz: res.uz,
        appliedN: applied,
        reactionN: res.reactionN,
        gasketForceN: gasketForceN(mesh, res.uz, closed, k),
        linearRuns: run,
        solverSeconds,
      };
    closed = upd.closed;
  }
  throw new CcxError(
    `The gasket contact set did not settle in ${MAX_RUNS} linear runs (${mesh.gasketCells.length} gasket cells); no result was kept.`,
    "",
  );
}

export interface GasketPathFeResult {
  modelKind: GasketPathModelKind;
  mesh: {
    /** Plate cells + gasket cells (CalculiX elements) and nodes. */
    elements: number;
    nodes: number;
    plateCells: number;
    gasketCells: number;
    elementSizeMm: number;
  };
  linearRuns: number;
  solverSeconds: number;
  /** Minimum preload of each bolt, N (the load of every bolt in the model). */
  boltForceN: number;
  /** Along the estimate's path: the same s (mm) as the core's profile, FE stress and the estimate, MPa, at minimum preload. */
  path: {
    kind: "gasket-centre-line" | "bolt-path";
    lengthMm: number;
    sMm: number[];
    stressMpa: number[];
    estimateMpa: number[];
    /** False inside a bolt hole or the bore on a full-face gasket's bolt path (stress 0 there, not counted). */
    onGasket: boolean[];
  };
  /** On the path; and over the whole meshed gasket, its closed share of area and highest cell-centre stress. */
  fe: {
    minMpa: number;
    maxMpa: number;
    minAtSMm: number;
    maxAtSMm: number;
    liftedLengthMm: number;
    closedAreaFraction: number;
    peakCellMpa: number;
  };
  estimate: { estimator: "cone" | "beam"; minMpa: number; maxMpa: number; liftedLengthMm: number };
  /** Over the modelled part (half a bolt for a sector): bolt loads, the gasket's reaction, |reaction/loads − 1|. */
  forceBalance: { boltLoadsN: number; gasketReactionN: number; contactForceN: number; error: number };
  equivalentPlate: { thicknessMm: number; modulusMpa: number; poisson: number; flexuralRigidityNmm: number };
  assumptions: string[];
  /** What the reader must know about this run's geometry (a gasket reaching beyond the plate, path points off it). */
  warnings: string[];
}

/** Runs model 2 on a design: the FE gasket stress along the gasket path at minimum preload. */
export async function runGasketPathCheck(
  design: JointDesign,
  options: GasketPathOptions = {},
): Promise<GasketPathFeResult> {
  const plan = planGasketPath(design, options.refine ?? 1);
  const sol = await solveGasketPath(plan.problem, options);
  options.onProgress?.("sampling", { elements: sol.mesh.elementCount, solverSeconds: sol.solverSeconds });
  const { profiles, governing } = estimateAtMinimumPreload(plan.model);
  const N = profiles.sampleCount;
  const step = profiles.pathLengthMm / N;
  const stress: number[] = [];
  let offPlate = 0;
  for (let j = 0; j < N; j++) {
    if (!profiles.onGasket[j]) {
      stress.push(0);
      continue;
    }
    const [x, y] = plan.toModel(profiles.xMm[j], profiles.yMm[j]);
    if (!sol.locator.find(x, y)?.inside) offPlate += step;
    stress.push(pressureAtMpa(sol.mesh, sol.locator, sol.uz, sol.closed, plan.kPerAreaMpaPerMm, x, y));
  }
  const warnings: string[] = [];
  let meshedGasket = 0;
  for (const e of sol.mesh.gasketCells) meshedGasket += sol.mesh.areaMm2[e];
  const wholeGasket = meshedGasket * (plan.kind === "circular-sector" ? 2 * plan.model.boltPoints.length : 1);
  const designGasket = plan.model.region.areaMm2;
  if (wholeGasket < 0.98 * designGasket)
    warnings.push(
      `Only ${wholeGasket.toFixed(0)} mm² of the design's ${designGasket.toFixed(0)} mm² gasket lies on the flange plate (outline minus bore and holes); the rest has nothing to press it, so the FE stress is that of the smaller gasket.`,
    );
  if (offPlate > 0)
    warnings.push(
      `${offPlate.toFixed(1)} mm of the gasket path lies off the plate's gasket cells; the FE values there are those of the nearest gasket cell's edge.`,
    );
  // Over the whole meshed gasket, not only the path: the closed share of its area and the highest
  // cell-centre stress (a plate that rotates about the gasket seats one edge and opens the other).
  let closedArea = 0;
  let peakCellMpa = 0;
  sol.mesh.gasketCells.forEach((e, g) => {
    if (!sol.closed[g]) return;
    closedArea += sol.mesh.areaMm2[e];
    peakCellMpa = Math.max(peakCellMpa, plan.kPerAreaMpaPerMm * approachAt(sol.mesh, sol.uz, e, 0, 0));
  });
  const closedAreaFraction = meshedGasket > 0 ? closedArea / meshedGasket : 0;
  let min = Infinity,
    max = -Infinity,
    iMin = 0,
    iMax = 0;
  for (let j = 0; j < N; j++) {
    if (!profiles.onGasket[j]) continue;
    if (stress[j] < min) [min, iMin] = [stress[j], j];
    if (stress[j] > max) [max, iMax] = [stress[j], j];
  }
  const tol = Math.max(max, 0) * 1e-9;
  let lifted = 0;
  for (let j = 0; j < N; j++) if (profiles.onGasket[j] && stress[j] <= tol) lifted += step;
  if (closedAreaFraction < 0.995)
    warnings.push(
      `The FE gasket is in contact over ${(closedAreaFraction * 100).toFixed(0)} % of its area (highest cell stress ${peakCellMpa.toFixed(1)} MPa); the rest opens under the plate's bending${lifted > 0 ? `, and ${lifted.toFixed(0)} mm of the path lies in the open part` : ""}. The estimate along the path does not model the plate turning about the gasket: where they differ, seat the gasket by the FE result or stiffen the joint.`,
    );
  const m = plan.model;
  const p = plan.plate;
  const layers = m.design.layers
    .map((l) => (l.role === "gasket" ? "gasket" : `${l.materialName || l.role} ${l.thicknessMm} mm`))
    .join(" / ");
  const gm = m.design.gasket.material;
  return {
    modelKind: plan.kind,
    mesh: {
      elements: sol.mesh.elementCount,
      nodes: sol.mesh.nodeCount,
      plateCells: sol.mesh.cellCount,
      gasketCells: sol.mesh.gasketCells.length,
      elementSizeMm: plan.elementSizeMm,
    },
    linearRuns: sol.linearRuns,
    solverSeconds: sol.solverSeconds,
    boltForceN: plan.boltForceN,
    path: {
      kind: m.region.kind === "full-face" ? "bolt-path" : "gasket-centre-line",
      lengthMm: profiles.pathLengthMm,
      sMm: Array.from(profiles.sMm),
      stressMpa: stress,
      estimateMpa: Array.from(governing.values),
      onGasket: Array.from(profiles.onGasket, (v) => v === 1),
    },
    fe: {
      minMpa: min,
      maxMpa: max,
      minAtSMm: profiles.sMm[iMin],
      maxAtSMm: profiles.sMm[iMax],
      liftedLengthMm: lifted,
      closedAreaFraction,
      peakCellMpa,
    },
    estimate: {
      estimator: governing.estimator,
      minMpa: governing.summary.minMpa,
      maxMpa: governing.summary.maxMpa,
      liftedLengthMm: governing.summary.unloadedLengthMm,
    },
    forceBalance: {
      boltLoadsN: sol.appliedN,
      gasketReactionN: sol.reactionN,
      contactForceN: sol.gasketForceN,
      error: Math.abs(sol.reactionN / sol.appliedN - 1),
    },
    equivalentPlate: {
      thicknessMm: p.thicknessMm,
      modulusMpa: p.modulusMpa,
      poisson: p.poisson,
      flexuralRigidityNmm: p.flexuralRigidityNmm,
    },
    assumptions: [
      plan.kind === "circular-sector"
        ? `Regular circular pattern: half a pitch (${(180 / m.boltPoints.length).toFixed(2)}°, from a bolt's centre line to mid-pitch) with symmetry planes on both edges.`
        : `Whole plate (${m.boltPoints.length} bolts), held in its plane by statically determinate pins.`,
      `Flanges ${layers} as one plate of the same bending stiffness: D = 1/(1/D_upper + 1/D_lower) = ${p.flexuralRigidityNmm.toExponential(3)} N·mm, i.e. ${p.thicknessMm.toFixed(2)} mm of E = ${p.modulusMpa} MPa, ν = ${p.poisson} [mem] (thin-plate theory: the relative approach of two plates of one planform under the same loads; each side's layers add, not bonded).`,
      `Plate: one layer of C3D8I solids through the thickness, elements about ${plan.elementSizeMm.toFixed(1)} mm (Gmsh quadrilaterals), bolt holes cut out; the estimate's path sampling (same s) for the FE curve.`,
      `Gasket: compression-only Winkler foundation over the ${m.region.kind === "full-face" ? "whole gasket area (full face, minus bore and holes)" : "gasket area"}, stiffness Eg/tg = ${gm.modulusMpa}/${gm.thicknessMm} MPa/mm (the core's foundation), no tension, no shear; lifted cells found by an active-set loop (${sol.linearRuns} linear runs).`,
      `Bolt loads at minimum preload ${(plan.boltForceN / 1000).toFixed(2)} kN each, uniform pressure on the bearing annulus (hole ${m.holeDiameterMm.toFixed(1)} mm to ${m.bearingDiameterMm.toFixed(1)} mm); no pressure or external load; linear elastic.`,
      "Not modelled: flange rotation at a hub or shell, raised faces, the gasket's nonlinear loading curve and creep, bolt bending. This is a linear-elastic model of stated assumptions, not an FE analysis qualified under the governing code.",
    ],
    warnings,
  };
}
