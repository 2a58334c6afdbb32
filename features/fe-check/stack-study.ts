/**
 * Bolt stack model solved with CalculiX (FE cross-check, model 1): the contact set of every
 * interface of a multi-layer stack is a fixed point of the active-set update of
 * `interface-study.ts` (closed cells in tension open, open cells that penetrate close, until no
 * cell changes). The edge search of `stack-edge-search.ts` finds it over bands closed from the hole
 * outwards in fewer linear runs than the plain update, which moves the edge one cell per run; the
 * plain update finishes whatever the search does not settle. Frictionless, compression-only,
 * linear elastic: the contact set does not depend on the load's size, so results scale with the
 * force. Server-side (runs ccx).
 */
import { availableParallelism, loadavg } from "node:os";
import { buildStackMesh, writeStackDeck, type StackMesh, type StackSpec } from "./stack-model";
import { CcxCancelled, runCcxAsync } from "./ccx-runner";
import { findBlock, nodeVectors, parseDat } from "./dat-parser";
import {
  bearingApproachMm,
  CCX_AXISYM_FORCE_FACTOR,
  interfaceCells,
  interfaceGaussStresses,
  loadedZoneRadiusMm,
  peakPressure,
  updateContactSet,
  type InterfaceCell,
} from "./interface-result";
import { nextEdges, settledEdge, type EdgePoint } from "./stack-edge-search";

export interface StackInterfaceResult {
  /** Names of the layers above and below. */
  between: [string, string];
  cells: InterfaceCell[];
  loadedRadiusMm: number;
  peakMpa: number;
  /** ∫ p dA / F (every interface carries the whole clamp force). */
  contactForceRatio: number;
}

export interface StackStudy {
  forceN: number;
  interfaces: StackInterfaceResult[];
  memberStiffnessNPerMm: number;
  /** Rigid bearing: |upper face reaction| / F (≈ 1); flexible: |support reaction| / F (≈ 0). */
  reactionRatio: number;
  linearRuns: number;
  /** Rounds of linear runs (runs of one round go side by side). */
  solverRounds: number;
  elements: number;
  nodes: number;
}

export interface StackRunHooks {
  /** Called after each linear run (for progress reports); throwing aborts the study. */
  onRun?: (run: number, elements: number, solverSeconds: number) => void | Promise<void>;
  /** Time limit of each linear run. */
  timeoutMs?: number;
  /** Aborting kills the running solver and ends the study with CcxCancelled. */
  signal?: AbortSignal;
  /** Linear runs side by side in the edge search (default: defaultParallelRuns()). */
  parallelRuns?: number;
}

function readStackRun(
  spec: StackSpec,
  mesh: StackMesh,
  closed: boolean[][],
  dat: string,
  forceN: number,
  approach: number,
) {
  const blocks = parseDat(dat);
  const u = nodeVectors(findBlock(blocks, "displacements", "NALL"));
  const uy = (n: number) => u.get(n)?.[1] ?? NaN;
  const gauss = interfaceGaussStresses(blocks);
  const nl = spec.layers.length;
  const interfaces = closed.map((c, k) =>
    interfaceCells(
      mesh.rs,
      c,
      gauss,
      (i) => mesh.interfaceElement(k, i),
      (i) => uy(mesh.node(k, i, 0)) - uy(mesh.node(k + 1, i, mesh.zs[k + 1].length - 1)),
    ),
  );
  const total = (set: string) =>
    (findBlock(blocks, "total force", set).rows[0]?.[1] ?? 0) * CCX_AXISYM_FORCE_FACTOR;
  let F = forceN;
  let delta = approach;
  if (spec.bearing === "rigid") F = total("NBEARBOT");
  else
    delta = bearingApproachMm(
      mesh.rs,
      mesh.bearingEnd,
      uy,
      (i) => mesh.node(nl - 1, i, 0),
      (i) => mesh.node(0, i, mesh.zs[0].length - 1),
    );
  const reaction = spec.bearing === "rigid" ? total("NBEARTOP") : total("NSUPPORT");
  return { interfaces, forceN: F, approachMm: delta, reactionN: reaction };
}

/**
 * Linear runs side by side in the edge search: two when the machine has two cores and one of them
 * is free (one-minute load average at most cores − 1), else one. On a busy machine a second run
 * only shares the same processor time (two runs side by side took twice as long each), and the
 * search needs a run or two more in pairs than one at a time.
 */
export function defaultParallelRuns(): number {
  const cores = availableParallelism();
  return cores >= 2 && loadavg()[0] <= cores - 1 ? 2 : 1;
}

/** Evidence of one prefix run on one interface for the edge search (see stack-edge-search.ts). */
function edgePoint(cells: InterfaceCell[], m: number, scale: number, tolMpa: number): EdgePoint {
  let firstTension = -1;
  let lastPenetration = -1;
  cells.forEach((c, i) => {
    if (c.closed && c.sigmaZzMpa > tolMpa && firstTension < 0) firstTension = i;
    if (!c.closed && c.gapMm < 0) lastPenetration = i;
  });
  const long = firstTension >= 0;
  return {
    m,
    g: m > 0 ? cells[m - 1].sigmaZzMpa * scale : -Infinity,
    long,
    bound: long ? firstTension : lastPenetration >= 0 ? lastPenetration + 1 : Infinity,
  };
}

/** Number of closed cells when the set is one band from the hole outwards, else −1. */
function prefixLength(closed: boolean[]): number {
  const m = closed.indexOf(false);
  if (m < 0) return closed.length;
  return closed.indexOf(true, m) < 0 ? m : -1;
}

const prefixSet = (m: number, n: number) => Array.from({ length: n }, (_, i) => i < m);
const setKey = (closed: boolean[][]) => closed.map((c) => c.map((x) => (x ? 1 : 0)).join("")).join("|");

interface EvaluatedRun {
  closed: boolean[][];
  res: ReturnType<typeof readStackRun>;
  /** The active-set update of this run's set, and how many cells it changes. */
  next: boolean[][];
  changed: number;
}

/**
 * The contact set of every interface, found by the edge search over bands closed from the hole
 * outwards (up to `parallelRuns` linear runs side by side), then checked by the active-set
 * update: the run returned is a fixed point of it (no closed cell in tension, no open cell
 * penetrating), as the plain active-set loop's was. A set the search does not settle (a contact
 * zone that is not one band, a search that stalls) goes on with the plain loop from the last run.
 */
export async function solveStack(
  spec: StackSpec,
  forceN: number,
  hooks: StackRunHooks = {},
  maxRuns = 40,
): Promise<StackStudy> {
  if (spec.layers.length < 2) throw new Error("the bolt stack model needs at least two clamped layers");
  const mesh = buildStackMesh(spec);
  const nCells = mesh.rs.length - 1;
  const nInterfaces = spec.layers.length - 1;
  const E = Math.max(...spec.layers.map((l) => l.modulusMpa));
  const approach = (forceN / (E * spec.holeDiameterMm)) * 2;
  const rb = spec.bearingDiameterMm / 2;
  const pScale = (4 * forceN) / (Math.PI * (spec.bearingDiameterMm ** 2 - spec.holeDiameterMm ** 2));
  const parallel = Math.max(1, Math.floor(hooks.parallelRuns ?? defaultParallelRuns()));
  const seen = new Map<string, EvaluatedRun>();
  const points: EdgePoint[][] = Array.from({ length: nInterfaces }, () => []);
  let runs = 0;
  let rounds = 0;

  const evaluate = async (closed: boolean[][], signal: AbortSignal): Promise<EvaluatedRun> => {
    const t0 = performance.now();
    const dat = await runCcxAsync(writeStackDeck(spec, mesh, { closed, forceN, approachMm: approach }), {
      timeoutMs: hooks.timeoutMs,
      signal,
    });
    if (hooks.signal?.aborted) throw new CcxCancelled();
    const run = ++runs;
    await hooks.onRun?.(run, mesh.elementCount, (performance.now() - t0) / 1000);
    if (hooks.signal?.aborted) throw new CcxCancelled();
    const res = readStackRun(spec, mesh, closed, dat, forceN, approach);
    const tol = 1e-6 * pScale * (res.forceN / forceN);
    let changed = 0;
    const next = res.interfaces.map((it) => {
      const upd = updateContactSet(it.cells, tol);
      changed += upd.changed;
      return upd.closed;
    });
    closed.forEach((c, k) => {
      const m = prefixLength(c);
      if (m >= 0) points[k].push(edgePoint(res.interfaces[k].cells, m, forceN / res.forceN, tol));
    });
    const done = { closed, res, next, changed };
    seen.set(setKey(closed), done);
    return done;
  };
  /** Runs the sets not run before, side by side; the runs of these sets, in order. */
  const evaluateAll = async (sets: boolean[][][]): Promise<EvaluatedRun[]> => {
    const fresh = sets
      .filter((c, i) => !seen.has(setKey(c)) && sets.findIndex((d) => setKey(d) === setKey(c)) === i)
      .slice(0, Math.max(0, maxRuns - runs));
    if (fresh.length) rounds++;
    const abort = new AbortController();
    const onAbort = () => abort.abort();
    if (hooks.signal?.aborted) throw new CcxCancelled();
    hooks.signal?.addEventListener("abort", onAbort, { once: true });
    try {
      // One failed run stops its neighbour (the error of the first one is the study's).
      await Promise.all(
        fresh.map((c) =>
          evaluate(c, abort.signal).catch((error: unknown) => {
            abort.abort();
            throw error;
          }),
        ),
      );
    } finally {
      hooks.signal?.removeEventListener("abort", onAbort);
    }
    return sets.map((c) => seen.get(setKey(c))).filter((r): r is EvaluatedRun => r !== undefined);
  };

  // First guess: each interface closed out to the bearing edge plus the thinner neighbour's thickness.
  const guess = spec.layers.slice(0, -1).map((l, k) => {
    const reach = rb + Math.min(l.thicknessMm, spec.layers[k + 1].thicknessMm);
    return mesh.rs.slice(0, -1).map((r, i) => (r + mesh.rs[i + 1]) / 2 <= reach);
  });
  let last = (await evaluateAll([guess]))[0];
  let final: EvaluatedRun | undefined;
  while (runs < maxRuns) {
    const settled = points.map((p) => settledEdge(p));
    if (settled.every((m) => m !== undefined)) {
      const set = settled.map((m) => prefixSet(m, nCells));
      const run = (await evaluateAll([set]))[0];
      if (run) last = run;
      if (run?.changed === 0) final = run;
      break;
    }
    const current = last.closed.map(prefixLength);
    const lengths = points.map((p, k) =>
      settled[k] !== undefined ? [settled[k]] : nextEdges(p, nCells, parallel),
    );
    if (lengths.some((l, k) => l.length === 0 && current[k] < 0)) break;
    const sets = Array.from({ length: parallel }, (_, j) =>
      lengths.map((l, k) => prefixSet(l[j] ?? l[0] ?? current[k], nCells)),
    ).filter((c) => !seen.has(setKey(c)));
    if (sets.length === 0) break;
    const round = await evaluateAll(sets);
    if (round.length === 0) break;
    last = round[0];
  }
  // Anything the edge search did not settle: the plain active-set loop from the last run.
  while (!final) {
    if (last.changed === 0) final = last;
    else if (runs >= maxRuns)
      throw new Error(
        `the contact set of the bolt stack did not settle in ${maxRuns} linear runs (${nCells} cells per interface)`,
      );
    else last = seen.get(setKey(last.next)) ?? (await evaluateAll([last.next]))[0];
  }
  const res = final.res;
  const k = forceN / res.forceN;
  return {
    forceN,
    interfaces: res.interfaces.map((it, j) => {
      const cells = it.cells.map((c) => ({
        ...c,
        pressureMpa: c.pressureMpa * k,
        sigmaZzMpa: c.sigmaZzMpa * k,
        gapMm: c.gapMm * k,
      }));
      return {
        between: [spec.layers[j].name, spec.layers[j + 1].name] as [string, string],
        cells,
        loadedRadiusMm: loadedZoneRadiusMm(cells),
        peakMpa: peakPressure(cells).peakMpa,
        contactForceRatio: it.contactForceN / res.forceN,
      };
    }),
    memberStiffnessNPerMm: res.forceN / res.approachMm,
    reactionRatio: Math.abs(res.reactionN) / res.forceN,
    linearRuns: runs,
    solverRounds: rounds,
    elements: mesh.elementCount,
    nodes: mesh.nodeCount,
  };
}
