/**
 * Bolt stack model solved with CalculiX (FE cross-check, model 1): the active-set loop of
 * `interface-study.ts` over every interface of a multi-layer stack (closed cells in tension open,
 * open cells that penetrate close, until no cell changes). Frictionless, compression-only, linear
 * elastic: the contact set does not depend on the load's size, so results scale with the force.
 * Server-side (runs ccx).
 */
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

export async function solveStack(
  spec: StackSpec,
  forceN: number,
  hooks: StackRunHooks = {},
  maxRuns = 40,
): Promise<StackStudy> {
  if (spec.layers.length < 2) throw new Error("the bolt stack model needs at least two clamped layers");
  const mesh = buildStackMesh(spec);
  const nCells = mesh.rs.length - 1;
  const E = Math.max(...spec.layers.map((l) => l.modulusMpa));
  const approach = (forceN / (E * spec.holeDiameterMm)) * 2;
  const rb = spec.bearingDiameterMm / 2;
  // First guess: each interface closed out to the bearing edge plus the thinner neighbour's thickness.
  let closed = spec.layers.slice(0, -1).map((l, k) => {
    const reach = rb + Math.min(l.thicknessMm, spec.layers[k + 1].thicknessMm);
    return mesh.rs.slice(0, -1).map((r, i) => (r + mesh.rs[i + 1]) / 2 <= reach);
  });
  const pScale = (4 * forceN) / (Math.PI * (spec.bearingDiameterMm ** 2 - spec.holeDiameterMm ** 2));
  for (let run = 1; run <= maxRuns; run++) {
    const t0 = performance.now();
    const dat = await runCcxAsync(writeStackDeck(spec, mesh, { closed, forceN, approachMm: approach }), {
      timeoutMs: hooks.timeoutMs,
      signal: hooks.signal,
    });
    await hooks.onRun?.(run, mesh.elementCount, (performance.now() - t0) / 1000);
    if (hooks.signal?.aborted) throw new CcxCancelled();
    const res = readStackRun(spec, mesh, closed, dat, forceN, approach);
    let changed = 0;
    const next = res.interfaces.map((it) => {
      const upd = updateContactSet(it.cells, 1e-6 * pScale * (res.forceN / forceN));
      changed += upd.changed;
      return upd.closed;
    });
    if (changed === 0) {
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
        linearRuns: run,
        elements: mesh.elementCount,
        nodes: mesh.nodeCount,
      };
    }
    closed = next;
  }
  throw new Error(
    `the contact set of the bolt stack did not settle in ${maxRuns} linear runs (${nCells} cells per interface)`,
  );
}
