/**
 * Axisymmetric model of one bolt clamping two plates: a structured CAX4 mesh of our own in the
 * r–z plane (r = CalculiX x, axis = y), a clearance hole, a bearing annulus on the top face of the
 * upper plate and on the bottom face of the lower plate, and a thin interface layer between the
 * plates that carries normal stress only (frictionless contact). Which interface cells are
 * closed is decided by the active-set loop in `interface-study.ts`; this module only writes the
 * deck for one given contact set. Pure: no file system, no process. Units: mm, N, MPa.
 */

export interface PlateSpec {
  thicknessMm: number;
  modulusMpa: number;
  poisson: number;
}

export type BearingMode = "flexible" | "rigid";

export interface AxisymSpec {
  /** Upper plate (bolt head side) and lower plate (nut side). */
  upper: PlateSpec;
  lower: PlateSpec;
  holeDiameterMm: number;
  bearingDiameterMm: number;
  /** Outer radius of both plates, mm. */
  outerRadiusMm: number;
  /**
   * "flexible": uniform pressure over each bearing annulus (a washer with no bending stiffness);
   * "rigid": each bearing annulus moves as one rigid face (prescribed equal axial displacement).
   */
  bearing: BearingMode;
  /** Target element size near the hole and interface, mm. */
  elementSizeMm: number;
}

export interface AxisymMesh {
  rs: number[];
  /** z coordinates of the lower plate rows (bottom to top, ending at its top face), then the upper plate. */
  zLower: number[];
  zUpper: number[];
  /** Node number at (column i, row j) of each plate. */
  nodeUpper: (i: number, j: number) => number;
  nodeLower: (i: number, j: number) => number;
  nodeCount: number;
  /** Element numbers of the interface layer, one per r column (index i spans rs[i]..rs[i+1]). */
  interfaceElements: number[];
  elementCount: number;
  /** Index of the last r node inside the bearing annulus (rs[bearingEnd] = bearing radius). */
  bearingEnd: number;
  layerThicknessMm: number;
}

/** Thickness of the interface layer relative to the element size; its axial modulus is stiff. */
export const LAYER_FRACTION = 0.005;
export const LAYER_STIFFNESS_FACTOR = 50;
export const OPEN_FACTOR = 1e-9;

export function graded(start: number, end: number, h0: number, growth: number, hMax: number): number[] {
  const out = [start];
  let h = h0;
  let x = start;
  while (end - x > 1e-9) {
    if (x + h >= end - 0.3 * h) {
      out.push(end);
      break;
    }
    x += h;
    out.push(x);
    h = Math.min(h * growth, hMax);
  }
  return out;
}

export function uniform(start: number, end: number, h: number): number[] {
  const n = Math.max(1, Math.ceil((end - start) / h - 1e-9));
  return Array.from({ length: n + 1 }, (_, i) => start + ((end - start) * i) / n);
}

/**
 * Radial grid: uniform from the hole to the bearing edge and on through a fine zone that covers
 * the contact zone (about bearing radius + 1.6·thicker plate), then graded out to the outer radius.
 * The bearing edge is always a node.
 */
export function buildAxisymMesh(spec: AxisymSpec): AxisymMesh {
  const h = spec.elementSizeMm;
  const ri = spec.holeDiameterMm / 2;
  const rb = spec.bearingDiameterMm / 2;
  const tMax = Math.max(spec.upper.thicknessMm, spec.lower.thicknessMm);
  const rFine = Math.min(spec.outerRadiusMm, rb + 1.6 * tMax + 2 * h);
  const inner = uniform(ri, rb, h);
  const fine = uniform(rb, rFine, h).slice(1);
  const outer = rFine < spec.outerRadiusMm ? graded(rFine, spec.outerRadiusMm, h, 1.15, 8 * h).slice(1) : [];
  const rs = [...inner, ...fine, ...outer];
  const bearingEnd = inner.length - 1;
  const nz = (t: number) => {
    // Rows: fine near both faces, coarser in the middle of a thick plate.
    const hz = Math.max(h, t / 40);
    return uniform(0, t, hz);
  };
  const e = LAYER_FRACTION * h;
  const zl = nz(spec.lower.thicknessMm).map((z) => z - spec.lower.thicknessMm);
  const zu = nz(spec.upper.thicknessMm).map((z) => z + e);
  const nr = rs.length;
  const nodeLower = (i: number, j: number) => 1 + j * nr + i;
  const offU = zl.length * nr;
  const nodeUpper = (i: number, j: number) => 1 + offU + j * nr + i;
  const nodeCount = offU + zu.length * nr;
  const elemLower = (nr - 1) * (zl.length - 1);
  const elemUpper = (nr - 1) * (zu.length - 1);
  const interfaceElements = Array.from({ length: nr - 1 }, (_, i) => elemLower + elemUpper + 1 + i);
  return {
    rs,
    zLower: zl,
    zUpper: zu,
    nodeUpper,
    nodeLower,
    nodeCount,
    interfaceElements,
    elementCount: elemLower + elemUpper + nr - 1,
    bearingEnd,
    layerThicknessMm: e,
  };
}

/** Output requests of an interface model: displacements, bearing and support reactions, interface stresses. */
export const INTERFACE_OUTPUT_REQUESTS = [
  "*NODE PRINT, NSET=NALL",
  "U",
  "*NODE PRINT, NSET=NBEARBOT, TOTALS=YES",
  "RF",
  "*NODE PRINT, NSET=NBEARTOP, TOTALS=YES",
  "RF",
  "*NODE PRINT, NSET=NSUPPORT, TOTALS=YES",
  "RF",
  "*EL PRINT, ELSET=ELAYER",
  "S",
  "*END STEP",
];

export function fmt(x: number): string {
  return x.toPrecision(12);
}

export function chunks(ids: number[], per = 12): string {
  const lines: string[] = [];
  for (let i = 0; i < ids.length; i += per) lines.push(ids.slice(i, i + per).join(", ") + ",");
  return lines.join("\n");
}

export interface DeckOptions {
  /** Closed state of each interface cell (length rs.length − 1). */
  closed: boolean[];
  /**
   * Flexible bearing: total clamp force, N (applied as pressure on both bearing annuli).
   * Rigid bearing: the faces approach by `approachMm` instead.
   */
  forceN: number;
  approachMm: number;
}

/** The CalculiX input deck for one contact set. */
export function writeAxisymDeck(spec: AxisymSpec, mesh: AxisymMesh, opt: DeckOptions): string {
  const { rs, zLower, zUpper, nodeLower, nodeUpper } = mesh;
  const nr = rs.length;
  const L: string[] = [
    "** Sealpitch axisymmetric bolted-plate model (features/fe-check)",
    "*NODE, NSET=NALL",
  ];
  zLower.forEach((z, j) => rs.forEach((r, i) => L.push(`${nodeLower(i, j)}, ${fmt(r)}, ${fmt(z)}`)));
  zUpper.forEach((z, j) => rs.forEach((r, i) => L.push(`${nodeUpper(i, j)}, ${fmt(r)}, ${fmt(z)}`)));

  // Plates: counter-clockwise CAX4 connectivity (r right, z up).
  let el = 1;
  const plateElements = (zs: number[], node: (i: number, j: number) => number, name: string) => {
    L.push(`*ELEMENT, TYPE=CAX4, ELSET=${name}`);
    const first = el;
    for (let j = 0; j < zs.length - 1; j++)
      for (let i = 0; i < nr - 1; i++)
        L.push(`${el++}, ${node(i, j)}, ${node(i + 1, j)}, ${node(i + 1, j + 1)}, ${node(i, j + 1)}`);
    return first;
  };
  const firstLower = plateElements(zLower, nodeLower, "ELOWER");
  const firstUpper = plateElements(zUpper, nodeUpper, "EUPPER");
  const topLower = zLower.length - 1;
  const closedIds: number[] = [];
  const openIds: number[] = [];
  L.push("*ELEMENT, TYPE=CAX4, ELSET=ELAYER");
  for (let i = 0; i < nr - 1; i++) {
    const id = mesh.interfaceElements[i];
    L.push(
      `${id}, ${nodeLower(i, topLower)}, ${nodeLower(i + 1, topLower)}, ${nodeUpper(i + 1, 0)}, ${nodeUpper(i, 0)}`,
    );
    (opt.closed[i] ? closedIds : openIds).push(id);
  }
  if (closedIds.length) L.push("*ELSET, ELSET=ECLOSED", chunks(closedIds));
  if (openIds.length) L.push("*ELSET, ELSET=EOPEN", chunks(openIds));

  const eRef = Math.max(spec.upper.modulusMpa, spec.lower.modulusMpa);
  const layerMaterial = (name: string, ez: number) => {
    const soft = eRef * OPEN_FACTOR * 10;
    // Engineering constants: E1 (r), E2 (z, normal to the interface), E3 (hoop), ν12 ν13 ν23, G12 G13 G23.
    L.push(`*MATERIAL, NAME=${name}`, "*ELASTIC, TYPE=ENGINEERING CONSTANTS");
    L.push(`${fmt(soft)}, ${fmt(ez)}, ${fmt(soft)}, 0, 0, 0, ${fmt(soft)}, ${fmt(soft)},`, `${fmt(soft)}`);
  };
  L.push(
    "*MATERIAL, NAME=MUPPER",
    "*ELASTIC",
    `${fmt(spec.upper.modulusMpa)}, ${spec.upper.poisson}`,
    "*MATERIAL, NAME=MLOWER",
    "*ELASTIC",
    `${fmt(spec.lower.modulusMpa)}, ${spec.lower.poisson}`,
  );
  layerMaterial("MCLOSED", eRef * LAYER_STIFFNESS_FACTOR);
  layerMaterial("MOPEN", eRef * OPEN_FACTOR);
  L.push("*SOLID SECTION, ELSET=EUPPER, MATERIAL=MUPPER", "*SOLID SECTION, ELSET=ELOWER, MATERIAL=MLOWER");
  if (closedIds.length) L.push("*SOLID SECTION, ELSET=ECLOSED, MATERIAL=MCLOSED");
  if (openIds.length) L.push("*SOLID SECTION, ELSET=EOPEN, MATERIAL=MOPEN");

  const topU = zUpper.length - 1;
  const bearTop = Array.from({ length: mesh.bearingEnd + 1 }, (_, i) => nodeUpper(i, topU));
  const bearBot = Array.from({ length: mesh.bearingEnd + 1 }, (_, i) => nodeLower(i, 0));
  L.push("*NSET, NSET=NBEARTOP", chunks(bearTop), "*NSET, NSET=NBEARBOT", chunks(bearBot));
  const iface = Array.from({ length: nr }, (_, i) => nodeUpper(i, 0));
  const ifaceLow = Array.from({ length: nr }, (_, i) => nodeLower(i, topLower));
  L.push("*NSET, NSET=NIFUP", chunks(iface), "*NSET, NSET=NIFLOW", chunks(ifaceLow));

  L.push("*NSET, NSET=NSUPPORT", `${nodeLower(nr - 1, Math.floor(zLower.length / 2))},`);
  L.push("*STEP", "*STATIC", "*BOUNDARY");
  if (spec.bearing === "rigid") {
    L.push("NBEARBOT, 2, 2, 0.0", `NBEARTOP, 2, 2, ${fmt(-opt.approachMm)}`);
  } else {
    // Balanced pressures; one node far out on the lower plate's mid-plane removes the rigid-body mode.
    L.push("NSUPPORT, 2, 2, 0.0");
  }
  if (spec.bearing === "flexible") {
    const ri = spec.holeDiameterMm / 2;
    const rb = spec.bearingDiameterMm / 2;
    const p = opt.forceN / (Math.PI * (rb * rb - ri * ri));
    L.push("*DLOAD");
    const rowU = zUpper.length - 2;
    for (let i = 0; i < mesh.bearingEnd; i++) {
      // CAX4 face 3 is the top edge (nodes 3–4); face 1 the bottom edge (nodes 1–2).
      L.push(`${firstUpper + rowU * (nr - 1) + i}, P3, ${fmt(p)}`);
      L.push(`${firstLower + i}, P1, ${fmt(p)}`);
    }
  }
  L.push(...INTERFACE_OUTPUT_REQUESTS);
  return L.join("\n") + "\n";
}
