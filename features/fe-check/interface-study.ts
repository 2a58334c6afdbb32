/**
 * One bolt clamping two plates, solved with CalculiX: the outer active-set loop over linear decks
 * (all interface cells closed at first; cells in tension open, open cells that penetrate close,
 * until the set stops changing). Frictionless, compression-only, linear elastic: the contact set
 * does not depend on the load's size, so every result scales with the clamp force.
 * Server-side (runs ccx); see interface-result.ts for the definitions of the outputs.
 */
import { buildAxisymMesh, writeAxisymDeck, type AxisymSpec } from "./axisym-model";
import { runCcx } from "./ccx-runner";
import { parseDat } from "./dat-parser";
import {
  loadedZoneRadiusMm,
  peakPressure,
  readRun,
  updateContactSet,
  type InterfaceCell,
} from "./interface-result";

export interface InterfaceStudy {
  spec: AxisymSpec;
  forceN: number;
  cells: InterfaceCell[];
  loadedRadiusMm: number;
  peakMpa: number;
  peakAtMm: number;
  memberStiffnessNPerMm: number;
  /** ∫ p dA / F; |reaction| / F: the upper face's reaction (rigid bearing, ≈ 1) or the support node's (flexible, ≈ 0). */
  contactForceRatio: number;
  reactionRatio: number;
  iterations: number;
  elements: number;
}

export function solveInterface(spec: AxisymSpec, forceN = 10_000, maxIterations = 40): InterfaceStudy {
  const mesh = buildAxisymMesh(spec);
  const nCells = mesh.interfaceElements.length;
  const E = Math.max(spec.upper.modulusMpa, spec.lower.modulusMpa);
  // A rigid bearing is driven by an approach; pick one of the right order for the force.
  const approach = (forceN / (E * spec.holeDiameterMm)) * 2;
  let runs = 0;
  const solve = (closed: boolean[]) => {
    runs++;
    const dat = runCcx(writeAxisymDeck(spec, mesh, { closed, forceN, approachMm: approach }));
    return readRun(spec, mesh, closed, forceN, approach, parseDat(dat));
  };
  const zone = (m: number) => Array.from({ length: nCells }, (_, i) => i < m);
  // First guess: one contact zone from the hole out to cell m, found by bisection (the last
  // closed cell must not pull, the first open one must not penetrate). The general update below
  // then checks every cell and carries on if the guess is not the solution.
  let lo = 1,
    hi = nCells;
  let m = Math.max(1, Math.min(nCells, Math.round(nCells / 3)));
  while (lo < hi) {
    const run = solve(zone(m));
    if (run.cells[m - 1].sigmaZzMpa > 0) hi = m - 1;
    else if (m < nCells && run.cells[m].gapMm < 0) lo = m + 1;
    else break;
    m = Math.floor((lo + hi + 1) / 2);
  }
  let closed = zone(Math.max(lo, Math.min(m, hi)));
  for (let it = 1; it <= maxIterations; it++) {
    const run = solve(closed);
    const pScale = (4 * run.forceN) / (Math.PI * (spec.bearingDiameterMm ** 2 - spec.holeDiameterMm ** 2));
    const next = updateContactSet(run.cells, 1e-6 * pScale);
    if (next.changed === 0) {
      // Scale to the requested force (linear problem, load-independent contact set).
      const k = forceN / run.forceN;
      const cells = run.cells.map((c) => ({
        ...c,
        pressureMpa: c.pressureMpa * k,
        sigmaZzMpa: c.sigmaZzMpa * k,
        gapMm: c.gapMm * k,
      }));
      const peak = peakPressure(cells);
      return {
        spec,
        forceN,
        cells,
        loadedRadiusMm: loadedZoneRadiusMm(cells),
        peakMpa: peak.peakMpa,
        peakAtMm: peak.atMm,
        memberStiffnessNPerMm: run.forceN / run.approachMm,
        contactForceRatio: run.contactForceN / run.forceN,
        reactionRatio: Math.abs(run.reactionN) / run.forceN,
        iterations: runs,
        elements: mesh.elementCount,
      };
    }
    closed = next.closed;
  }
  throw new Error(`contact set did not settle in ${maxIterations} linear runs`);
}
