/**
 * Post-processing of one axisymmetric run (pure): interface pressure p(r) per interface cell,
 * the contact update of the active-set loop, the loaded-zone radius, the member stiffness and
 * the force balance. Units: mm, N, MPa.
 *
 * Definitions (used by the calibration and by the FE cross-check):
 * - p(r): −σzz of the interface cell, mean over its integration points, at the cell's mid radius.
 * - Loaded-zone radius rc: the outer end of the contact zone that starts at the hole. Near a
 *   receding contact edge p falls like √(rc − r), so rc is where the line through p² at the last
 *   two closed cells reaches zero, kept between the last closed cell's centre and the next cell's
 *   centre.
 * - Member stiffness km = F / δ with δ the relative approach of the two bearing faces: for a
 *   rigid bearing the prescribed approach; for a flexible (uniform-pressure) bearing the
 *   area-weighted mean axial displacement of the upper bearing annulus minus that of the lower
 *   one (the work-conjugate approach: F·δ/2 is the strain energy).
 * - F: the clamp force. Flexible bearing: the applied force (balanced pressures; the one support
 *   node's reaction should vanish). Rigid bearing: the reaction on the lower bearing face. CalculiX reports axisymmetric forces per 2° segment (×180 for the ring).
 */
import type { AxisymMesh, AxisymSpec } from "./axisym-model";
import { findBlock, nodeVectors, type DatBlock } from "./dat-parser";

/** Axisymmetric CalculiX forces and reactions are for a 2° segment of the ring. */
export const CCX_AXISYM_FORCE_FACTOR = 180;

export interface InterfaceCell {
  r0: number;
  r1: number;
  rMid: number;
  /** Contact pressure, MPa (≥ 0 where closed; 0 where open). */
  pressureMpa: number;
  /** σzz of the cell (closed cells), MPa: positive = tension (the cell must open). */
  sigmaZzMpa: number;
  /** Opening of the interface at the cell, mm (open cells): negative = penetration. */
  gapMm: number;
  closed: boolean;
}

export interface RunResult {
  cells: InterfaceCell[];
  forceN: number;
  /** Reaction on the upper bearing face (rigid: equal and opposite to F) or at the support node (flexible: ≈ 0), N. */
  reactionN: number;
  /** ∫ p dA over the interface, N. */
  contactForceN: number;
  approachMm: number;
}

export function readRun(
  spec: AxisymSpec,
  mesh: AxisymMesh,
  closed: boolean[],
  forceN: number,
  approachMm: number,
  blocks: DatBlock[],
): RunResult {
  const u = nodeVectors(findBlock(blocks, "displacements", "NALL"));
  const gauss = interfaceGaussStresses(blocks);
  const rfBot = findBlock(blocks, "total force", "NBEARBOT").rows[0]?.[1] ?? 0;
  const rfSupport = findBlock(blocks, "total force", "NSUPPORT").rows[0]?.[1] ?? 0;
  const rfTop = findBlock(blocks, "total force", "NBEARTOP").rows[0]?.[1] ?? 0;
  const { rs, nodeUpper, nodeLower } = mesh;
  const topLower = mesh.zLower.length - 1;
  const uy = (n: number) => u.get(n)?.[1] ?? NaN;
  const { cells, contactForceN: contact } = interfaceCells(
    rs,
    closed,
    gauss,
    (i) => mesh.interfaceElements[i],
    (i) => uy(nodeUpper(i, 0)) - uy(nodeLower(i, topLower)),
  );
  const reaction = rfBot * CCX_AXISYM_FORCE_FACTOR;
  let F = forceN;
  let delta = approachMm;
  if (spec.bearing === "rigid") F = reaction;
  else {
    const topU = mesh.zUpper.length - 1;
    delta = bearingApproachMm(
      rs,
      mesh.bearingEnd,
      uy,
      (i) => nodeLower(i, 0),
      (i) => nodeUpper(i, topU),
    );
  }
  return {
    cells,
    forceN: F,
    reactionN: (spec.bearing === "rigid" ? rfTop : rfSupport) * CCX_AXISYM_FORCE_FACTOR,
    contactForceN: contact,
    approachMm: delta,
  };
}

/**
 * Work-conjugate approach of two uniformly loaded bearing annuli: the area-weighted mean axial
 * displacement of the lower annulus minus that of the upper one, mm.
 */
export function bearingApproachMm(
  rs: number[],
  bearingEnd: number,
  uy: (node: number) => number,
  lowerNode: (i: number) => number,
  upperNode: (i: number) => number,
): number {
  const meanUy = (node: (i: number) => number) => {
    let a = 0,
      w = 0;
    for (let i = 0; i < bearingEnd; i++) {
      const dA = rs[i + 1] ** 2 - rs[i] ** 2;
      a += ((uy(node(i)) + uy(node(i + 1))) / 2) * dA;
      w += dA;
    }
    return a / w;
  };
  return meanUy(lowerNode) - meanUy(upperNode);
}

/** σzz at the inner and outer Gauss radius of each interface cell: element id → [sum in, sum out, n in, n out]. */
export function interfaceGaussStresses(blocks: DatBlock[]): Map<number, [number, number, number, number]> {
  // Integration points of the expanded CAX4 cell: odd numbers at the inner Gauss radius, even at the outer.
  const gauss = new Map<number, [number, number, number, number]>();
  for (const row of findBlock(blocks, "stresses", "ELAYER").rows) {
    const g = gauss.get(row[0]) ?? [0, 0, 0, 0];
    const k = row[1] % 2 === 1 ? 0 : 1;
    g[k] += row[3];
    g[k + 2]++;
    gauss.set(row[0], g);
  }
  return gauss;
}

/**
 * The cells of one interface from its Gauss stresses and node gaps: `element(i)` is cell i's
 * element id, `gapAt(i)` the opening at radial node i (upper minus lower axial displacement).
 * Also ∫ p dA over the closed cells, N.
 */
export function interfaceCells(
  rs: number[],
  closed: boolean[],
  gauss: Map<number, [number, number, number, number]>,
  element: (i: number) => number,
  gapAt: (i: number) => number,
): { cells: InterfaceCell[]; contactForceN: number } {
  const cells: InterfaceCell[] = [];
  let contact = 0;
  for (let i = 0; i < rs.length - 1; i++) {
    const g = gauss.get(element(i));
    const sIn = g ? g[0] / g[2] : NaN;
    const sOut = g ? g[1] / g[3] : NaN;
    const sig = (sIn + sOut) / 2;
    // ∫ σ·2πr dr over the cell by its two Gauss points (the rule the element itself integrates with).
    const dr = rs[i + 1] - rs[i];
    const rIn = (rs[i] + rs[i + 1]) / 2 - dr / (2 * Math.sqrt(3));
    const rOut = (rs[i] + rs[i + 1]) / 2 + dr / (2 * Math.sqrt(3));
    const cellForce = -Math.PI * dr * (sIn * rIn + sOut * rOut);
    const gap = (gapAt(i) + gapAt(i + 1)) / 2;
    if (closed[i]) contact += cellForce;
    cells.push({
      r0: rs[i],
      r1: rs[i + 1],
      rMid: (rs[i] + rs[i + 1]) / 2,
      pressureMpa: closed[i] ? Math.max(-sig, 0) : 0,
      sigmaZzMpa: sig,
      gapMm: gap,
      closed: closed[i],
    });
  }
  return { cells, contactForceN: contact };
}

/** Next contact set: closed cells in tension open; open cells that penetrate close. */
export function updateContactSet(
  cells: InterfaceCell[],
  tolMpa: number,
): { closed: boolean[]; changed: number } {
  let changed = 0;
  const closed = cells.map((c) => {
    if (c.closed && c.sigmaZzMpa > tolMpa) {
      changed++;
      return false;
    }
    if (!c.closed && c.gapMm < 0) {
      changed++;
      return true;
    }
    return c.closed;
  });
  return { closed, changed };
}

/** Loaded-zone radius (see the module comment), mm; the hole radius when nothing is closed. */
export function loadedZoneRadiusMm(cells: InterfaceCell[]): number {
  let i = cells.findIndex((c) => c.closed && c.pressureMpa > 0);
  if (i < 0) return cells[0]?.r0 ?? 0;
  while (i + 1 < cells.length && cells[i + 1].closed && cells[i + 1].pressureMpa > 0) i++;
  const last = cells[i];
  if (i + 1 >= cells.length) return last.r1;
  const next = cells[i + 1];
  if (i === 0) return last.r1;
  const prev = cells[i - 1];
  const a = prev.pressureMpa ** 2;
  const b = last.pressureMpa ** 2;
  let r = last.r1;
  if (a > b) r = last.rMid + (b * (last.rMid - prev.rMid)) / (a - b);
  return Math.min(Math.max(r, last.rMid), next.rMid);
}

/** Peak interface pressure and where it is, MPa / mm. */
export function peakPressure(cells: InterfaceCell[]): { peakMpa: number; atMm: number } {
  let best = cells[0];
  for (const c of cells) if (c.pressureMpa > best.pressureMpa) best = c;
  return { peakMpa: best?.pressureMpa ?? 0, atMm: best?.rMid ?? 0 };
}
