/**
 * Bolt stack model (FE cross-check, model 1): the axisymmetric CAX4 mesh of `axisym-model.ts`
 * generalised to any number of clamped layers, top (head or nut side) to bottom. Between each two
 * layers a thin interface layer carries normal stress only (frictionless, compression-only contact,
 * decided per cell by the active-set loop in `stack-study.ts`). A full-face gasket is one of the
 * layers, with ν = 0 so that its through-thickness stiffness is the stated compression modulus
 * Eg (the meaning the estimate gives it). Bearing annulus on the top face of the first layer and
 * the bottom face of the last one: uniform pressure ("flexible") or a rigid face ("rigid").
 * Pure: no file system, no process. Units: mm, N, MPa.
 */
import {
  chunks,
  fmt,
  graded,
  INTERFACE_OUTPUT_REQUESTS,
  LAYER_FRACTION,
  LAYER_STIFFNESS_FACTOR,
  OPEN_FACTOR,
  uniform,
  type BearingMode,
} from "./axisym-model";

export interface StackLayerSpec {
  name: string;
  thicknessMm: number;
  modulusMpa: number;
  poisson: number;
}

export interface StackSpec {
  /** Top (bearing face of the head or nut) to bottom (the other bearing face). At least two. */
  layers: StackLayerSpec[];
  holeDiameterMm: number;
  bearingDiameterMm: number;
  outerRadiusMm: number;
  bearing: BearingMode;
  elementSizeMm: number;
}

export interface StackMesh {
  rs: number[];
  /** z rows of each layer, bottom to top (layer 0 is the top layer, so it has the highest z). */
  zs: number[][];
  node: (layer: number, i: number, j: number) => number;
  nodeCount: number;
  /** Element id of interface cell (interface k below layer k, column i). */
  interfaceElement: (k: number, i: number) => number;
  /** First element id of each layer's solid block. */
  firstElement: number[];
  elementCount: number;
  bearingEnd: number;
  layerThicknessMm: number;
}

/** The two-plate model's radial grid (fine to the bearing radius + 1.6 × the thickest layer); each layer gets rows of max(h, t/40). */
export function buildStackMesh(spec: StackSpec): StackMesh {
  const h = spec.elementSizeMm;
  const ri = spec.holeDiameterMm / 2;
  const rb = spec.bearingDiameterMm / 2;
  const tMax = Math.max(...spec.layers.map((l) => l.thicknessMm));
  const rFine = Math.min(spec.outerRadiusMm, rb + 1.6 * tMax + 2 * h);
  const inner = uniform(ri, rb, h);
  const fine = uniform(rb, rFine, h).slice(1);
  const outer = rFine < spec.outerRadiusMm ? graded(rFine, spec.outerRadiusMm, h, 1.15, 8 * h).slice(1) : [];
  const rs = [...inner, ...fine, ...outer];
  const nr = rs.length;
  const e = LAYER_FRACTION * h;
  // Build bottom-up: the last layer sits at z = 0 downwards.
  const zs: number[][] = new Array(spec.layers.length);
  let top = 0;
  for (let k = spec.layers.length - 1; k >= 0; k--) {
    const t = spec.layers[k].thicknessMm;
    const rows = uniform(0, t, Math.max(h, t / 40));
    const base = k === spec.layers.length - 1 ? -t : top + e;
    zs[k] = rows.map((z) => z + base);
    top = zs[k][zs[k].length - 1];
  }
  const nodeOffset: number[] = [];
  let n = 0;
  for (let k = 0; k < spec.layers.length; k++) {
    nodeOffset.push(n);
    n += zs[k].length * nr;
  }
  const firstElement: number[] = [];
  let el = 1;
  for (let k = 0; k < spec.layers.length; k++) {
    firstElement.push(el);
    el += (zs[k].length - 1) * (nr - 1);
  }
  const firstInterface = el;
  const nInterfaces = spec.layers.length - 1;
  return {
    rs,
    zs,
    node: (k, i, j) => 1 + nodeOffset[k] + j * nr + i,
    nodeCount: n,
    interfaceElement: (k, i) => firstInterface + k * (nr - 1) + i,
    firstElement,
    elementCount: el - 1 + nInterfaces * (nr - 1),
    bearingEnd: inner.length - 1,
    layerThicknessMm: e,
  };
}

export interface StackDeckOptions {
  /** closed[k][i]: interface k (below layer k), column i. */
  closed: boolean[][];
  forceN: number;
  approachMm: number;
}

export function writeStackDeck(spec: StackSpec, mesh: StackMesh, opt: StackDeckOptions): string {
  const { rs, zs, node } = mesh;
  const nr = rs.length;
  const nl = spec.layers.length;
  const L: string[] = ["** Sealpitch bolt stack model (features/fe-check)", "*NODE, NSET=NALL"];
  for (let k = 0; k < nl; k++)
    zs[k].forEach((z, j) => rs.forEach((r, i) => L.push(`${node(k, i, j)}, ${fmt(r)}, ${fmt(z)}`)));
  for (let k = 0; k < nl; k++) {
    L.push(`*ELEMENT, TYPE=CAX4, ELSET=EL${k}`);
    let el = mesh.firstElement[k];
    for (let j = 0; j < zs[k].length - 1; j++)
      for (let i = 0; i < nr - 1; i++)
        L.push(
          `${el++}, ${node(k, i, j)}, ${node(k, i + 1, j)}, ${node(k, i + 1, j + 1)}, ${node(k, i, j + 1)}`,
        );
  }
  const closedIds: number[] = [];
  const openIds: number[] = [];
  L.push("*ELEMENT, TYPE=CAX4, ELSET=ELAYER");
  for (let k = 0; k < nl - 1; k++) {
    const jTopBelow = zs[k + 1].length - 1;
    for (let i = 0; i < nr - 1; i++) {
      const id = mesh.interfaceElement(k, i);
      L.push(
        `${id}, ${node(k + 1, i, jTopBelow)}, ${node(k + 1, i + 1, jTopBelow)}, ${node(k, i + 1, 0)}, ${node(k, i, 0)}`,
      );
      (opt.closed[k][i] ? closedIds : openIds).push(id);
    }
  }
  if (closedIds.length) L.push("*ELSET, ELSET=ECLOSED", chunks(closedIds));
  if (openIds.length) L.push("*ELSET, ELSET=EOPEN", chunks(openIds));
  const eRef = Math.max(...spec.layers.map((l) => l.modulusMpa));
  spec.layers.forEach((l, k) =>
    L.push(`*MATERIAL, NAME=M${k}`, "*ELASTIC", `${fmt(l.modulusMpa)}, ${l.poisson}`),
  );
  const layerMaterial = (name: string, ez: number) => {
    const soft = eRef * OPEN_FACTOR * 10;
    L.push(`*MATERIAL, NAME=${name}`, "*ELASTIC, TYPE=ENGINEERING CONSTANTS");
    L.push(`${fmt(soft)}, ${fmt(ez)}, ${fmt(soft)}, 0, 0, 0, ${fmt(soft)}, ${fmt(soft)},`, `${fmt(soft)}`);
  };
  layerMaterial("MCLOSED", eRef * LAYER_STIFFNESS_FACTOR);
  layerMaterial("MOPEN", eRef * OPEN_FACTOR);
  spec.layers.forEach((_, k) => L.push(`*SOLID SECTION, ELSET=EL${k}, MATERIAL=M${k}`));
  if (closedIds.length) L.push("*SOLID SECTION, ELSET=ECLOSED, MATERIAL=MCLOSED");
  if (openIds.length) L.push("*SOLID SECTION, ELSET=EOPEN, MATERIAL=MOPEN");
  const topRow = zs[0].length - 1;
  const bearTop = Array.from({ length: mesh.bearingEnd + 1 }, (_, i) => node(0, i, topRow));
  const bearBot = Array.from({ length: mesh.bearingEnd + 1 }, (_, i) => node(nl - 1, i, 0));
  L.push("*NSET, NSET=NBEARTOP", chunks(bearTop), "*NSET, NSET=NBEARBOT", chunks(bearBot));
  L.push("*NSET, NSET=NSUPPORT", `${node(nl - 1, nr - 1, Math.floor(zs[nl - 1].length / 2))},`);
  L.push("*STEP", "*STATIC", "*BOUNDARY");
  if (spec.bearing === "rigid") L.push("NBEARBOT, 2, 2, 0.0", `NBEARTOP, 2, 2, ${fmt(-opt.approachMm)}`);
  else {
    L.push("NSUPPORT, 2, 2, 0.0", "*DLOAD");
    const ri = spec.holeDiameterMm / 2;
    const rb = spec.bearingDiameterMm / 2;
    const p = opt.forceN / (Math.PI * (rb * rb - ri * ri));
    const rowTop = zs[0].length - 2;
    for (let i = 0; i < mesh.bearingEnd; i++) {
      L.push(`${mesh.firstElement[0] + rowTop * (nr - 1) + i}, P3, ${fmt(p)}`);
      L.push(`${mesh.firstElement[nl - 1] + i}, P1, ${fmt(p)}`);
    }
  }
  L.push(...INTERFACE_OUTPUT_REQUESTS);
  return L.join("\n") + "\n";
}
