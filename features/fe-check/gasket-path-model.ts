/**
 * Gasket path model (FE cross-check, model 2): the flange as one plate of solid elements on a
 * compression-only gasket foundation, loaded by the bolts on their bearing annuli. Pure: writes
 * the Gmsh geometry of the plate's planform, reads Gmsh's 2D quadrilateral mesh, extrudes it into
 * the 3D model and writes the CalculiX deck for one contact set. The active-set loop that decides
 * which gasket cells are closed is in `gasket-path-study.ts`; sampling along the gasket path in
 * `gasket-path-result.ts`. Units: mm, N, MPa.
 *
 * The model, through the thickness (z up, gasket plane z = 0):
 * - plate: one layer of C3D8I (incompatible modes: exact in pure bending with one layer) over
 *   0 ≤ z ≤ t, of the equivalent thickness t that gives the clamped layers' combined bending
 *   stiffness (see `gasket-path-joint.ts`);
 * - gasket: one layer of C3D8 over −tg ≤ z ≤ 0 under every gasket cell, through-thickness
 *   modulus Eg, ν = 0 and near-zero in-plane and shear moduli, so each column is an independent
 *   spring of stiffness Eg/tg per unit area (a Winkler foundation over the gasket area, the
 *   foundation of the core's beam estimate); its bottom face is fixed. An open cell has every
 *   modulus near zero (the plate lifts off freely there);
 * - loads: uniform pressure on the bearing annuli of the top face (each bolt's force spread over
 *   the meshed annulus, so the applied total equals the bolt force exactly);
 * - symmetry planes (normal displacement zero, through a local *TRANSFORM) where the model is a
 *   sector or a strip; in-plane pins (statically determinate) for a whole plate.
 */
import type { ClosedPath } from "@/features/analysis/core/path";
import { chunks, fmt } from "./axisym-model";

/** Modulus of an open gasket cell, and the in-plane and shear moduli of a closed one, relative to Eg. */
export const GASKET_SOFT_FACTOR = 1e-6;

export interface Circle {
  x: number;
  y: number;
  r: number;
}

/** The plate's planform for Gmsh: outline minus bore and holes, optionally cut to a wedge, with embedded curves. */
export interface Planform {
  outer: ClosedPath;
  inner: ClosedPath | null;
  holes: Circle[];
  /** Keep only 0 ≤ θ ≤ angleRad (a sector with its first edge on the +x axis). */
  wedgeRad: number | null;
  /** Curves the mesh must follow (gasket edges, bearing circles, load band edges). */
  curves: { paths: ClosedPath[]; circles: Circle[]; lines: [number, number, number, number][] };
  /** Largest element edge, mm; Gmsh's all-quadrilateral subdivision halves what it is given. */
  elementSizeMm: number;
  /** Elements per full turn of a curved edge (holes, bearing circles). */
  elementsPerTurn: number;
}

export interface PlateLoad {
  label: string;
  forceN: number;
  /** True when a cell whose corners' mean is (x, y) belongs to this load's area. */
  inside: (x: number, y: number) => boolean;
}

export interface SymmetryPlane {
  /** A point of the plane and its unit normal (in the xy plane). */
  px: number;
  py: number;
  nx: number;
  ny: number;
}

export interface GasketPathProblem {
  planform: Planform;
  plate: { thicknessMm: number; modulusMpa: number; poisson: number };
  gasket: { thicknessMm: number; modulusMpa: number };
  isGasket: (x: number, y: number) => boolean;
  loads: PlateLoad[];
  symmetry: SymmetryPlane[];
  /** In-plane supports at the plate's mid-plane node nearest each point (dofs 1 = x, 2 = y). */
  pins: { x: number; y: number; dofs: (1 | 2)[] }[];
}

// ---------------------------------------------------------------------------------------------
// Gmsh geometry
// ---------------------------------------------------------------------------------------------

function geoNumber(x: number): string {
  return Number.isFinite(x) ? x.toPrecision(12) : "0";
}

/** Gmsh .geo text (OpenCASCADE kernel) of the planform, meshed into quadrilaterals only. */
export function writePlanformGeo(pf: Planform): string {
  // Tags through Gmsh's new* counters (Boolean operations renumber entities).
  const L: string[] = ['SetFactory("OpenCASCADE");', "Geometry.Tolerance = 1e-6;"];
  let v = 0;
  const point = (x: number, y: number) => {
    const name = `p${++v}`;
    L.push(`${name} = newp; Point(${name}) = {${geoNumber(x)}, ${geoNumber(y)}, 0};`);
    return name;
  };
  const curve = (kind: "Line" | "Circle", nodes: string) => {
    const name = `c${++v}`;
    L.push(`${name} = newc; ${kind}(${name}) = {${nodes}};`);
    return name;
  };
  /** Curves of a closed path (lines, and arcs in pieces of at most 90°). */
  const pathCurves = (path: ClosedPath): string[] => {
    const tags: string[] = [];
    const first = path.segments[0];
    const p0 =
      first.kind === "line"
        ? point(first.x0, first.y0)
        : point(
            first.cx + first.radiusMm * Math.cos(first.startRad),
            first.cy + first.radiusMm * Math.sin(first.startRad),
          );
    let prev = p0;
    path.segments.forEach((s, i) => {
      const last = i === path.segments.length - 1;
      if (s.kind === "line") {
        const next = last ? p0 : point(s.x1, s.y1);
        tags.push(curve("Line", `${prev}, ${next}`));
        prev = next;
        return;
      }
      const pieces = Math.max(1, Math.ceil(Math.abs(s.sweepRad) / (Math.PI / 2) - 1e-9));
      const c = point(s.cx, s.cy);
      for (let k = 1; k <= pieces; k++) {
        const a = s.startRad + (s.sweepRad * k) / pieces;
        const next =
          last && k === pieces ? p0 : point(s.cx + s.radiusMm * Math.cos(a), s.cy + s.radiusMm * Math.sin(a));
        tags.push(curve("Circle", `${prev}, ${c}, ${next}`));
        prev = next;
      }
    });
    return tags;
  };
  const surfaceOf = (tags: string[]) => {
    const loop = `l${++v}`;
    const name = `s${++v}`;
    L.push(
      `${loop} = newll; Curve Loop(${loop}) = {${tags.join(", ")}};`,
      `${name} = news; Plane Surface(${name}) = {${loop}};`,
    );
    return name;
  };
  L.push(`plate() = {${surfaceOf(pathCurves(pf.outer))}};`);
  const cut: string[] = [];
  if (pf.inner) cut.push(surfaceOf(pathCurves(pf.inner)));
  for (const h of pf.holes) {
    const name = `s${++v}`;
    L.push(`${name} = news; Disk(${name}) = {${geoNumber(h.x)}, ${geoNumber(h.y)}, 0, ${geoNumber(h.r)}};`);
    cut.push(name);
  }
  if (cut.length)
    L.push(
      `plate() = BooleanDifference{ Surface{plate()}; Delete; }{ Surface{${cut.join(", ")}}; Delete; };`,
    );
  if (pf.wedgeRad !== null) {
    const R = 4 * Math.max(...pf.outer.segments.map((s) => extent(s)));
    const a = pf.wedgeRad;
    const o = point(0, 0);
    const p1 = point(R, 0);
    const p2 = point(R * Math.cos(a), R * Math.sin(a));
    const w = surfaceOf([
      curve("Line", `${o}, ${p1}`),
      curve("Line", `${p1}, ${p2}`),
      curve("Line", `${p2}, ${o}`),
    ]);
    L.push(`plate() = BooleanIntersection{ Surface{plate()}; Delete; }{ Surface{${w}}; Delete; };`);
  }
  const embedded: string[] = [];
  for (const p of pf.curves.paths) embedded.push(...pathCurves(p));
  for (const c of pf.curves.circles) {
    const name = `c${++v}`;
    L.push(`${name} = newc; Circle(${name}) = {${geoNumber(c.x)}, ${geoNumber(c.y)}, 0, ${geoNumber(c.r)}};`);
    embedded.push(name);
  }
  for (const [x0, y0, x1, y1] of pf.curves.lines)
    embedded.push(curve("Line", `${point(x0, y0)}, ${point(x1, y1)}`));
  if (embedded.length)
    L.push(`BooleanFragments{ Surface{plate()}; Delete; }{ Curve{${embedded.join(", ")}}; Delete; }`);
  // The all-quadrilateral subdivision splits every element in four: mesh at twice the size.
  L.push(
    `Mesh.MeshSizeMax = ${geoNumber(2 * pf.elementSizeMm)};`,
    `Mesh.MeshSizeMin = ${geoNumber(pf.elementSizeMm / 8)};`,
    `Mesh.MeshSizeFromCurvature = ${Math.max(4, Math.round(pf.elementsPerTurn / 2))};`,
    "Mesh.MeshSizeFromPoints = 0;",
    "Mesh.Algorithm = 6;",
    "Mesh.RecombineAll = 1;",
    "Mesh.RecombinationAlgorithm = 1;",
    "Mesh.SubdivisionAlgorithm = 1;",
    "Mesh.ElementOrder = 1;",
    "Mesh.Smoothing = 4;",
  );
  return L.join("\n") + "\n";
}

function extent(s: ClosedPath["segments"][number]): number {
  return s.kind === "line"
    ? Math.max(Math.hypot(s.x0, s.y0), Math.hypot(s.x1, s.y1))
    : Math.hypot(s.cx, s.cy) + s.radiusMm;
}

// ---------------------------------------------------------------------------------------------
// Gmsh mesh (MSH 2.2 ASCII) → 2D quadrilaterals
// ---------------------------------------------------------------------------------------------

export interface QuadMesh {
  x: Float64Array;
  y: Float64Array;
  /** Corner node indices of each quadrilateral, counter-clockwise (z up). */
  quads: Int32Array;
}

/** Reads the nodes and 4-node quadrilaterals (type 3) of an MSH 2.2 file; other elements are skipped. */
export function parseMsh22(text: string): QuadMesh {
  const lines = text.split(/\r?\n/);
  let i = lines.findIndex((l) => l.trim() === "$Nodes");
  if (i < 0) throw new Error("the Gmsh mesh has no $Nodes section");
  const nNodes = Number(lines[i + 1]);
  const ids = new Map<number, [number, number]>();
  for (let k = 0; k < nNodes; k++) {
    const p = lines[i + 2 + k].trim().split(/\s+/).map(Number);
    ids.set(p[0], [p[1], p[2]]);
  }
  i = lines.findIndex((l) => l.trim() === "$Elements");
  if (i < 0) throw new Error("the Gmsh mesh has no $Elements section");
  const nEl = Number(lines[i + 1]);
  const raw: number[][] = [];
  for (let k = 0; k < nEl; k++) {
    const p = lines[i + 2 + k].trim().split(/\s+/).map(Number);
    if (p[1] === 3) raw.push(p.slice(3 + p[2], 7 + p[2]));
    else if (p[1] === 2) throw new Error("the Gmsh mesh has triangles; the model needs quadrilaterals only");
  }
  const index = new Map<number, number>();
  const xs: number[] = [];
  const ys: number[] = [];
  const quads = new Int32Array(raw.length * 4);
  raw.forEach((q, e) => {
    const local = q.map((id) => {
      let j = index.get(id);
      if (j === undefined) {
        const c = ids.get(id);
        if (!c) throw new Error(`the Gmsh mesh refers to a missing node ${id}`);
        j = xs.length;
        index.set(id, j);
        xs.push(c[0]);
        ys.push(c[1]);
      }
      return j;
    });
    let area = 0;
    for (let k = 0; k < 4; k++) {
      const a = local[k];
      const b = local[(k + 1) % 4];
      area += xs[a] * ys[b] - xs[b] * ys[a];
    }
    if (area < 0) local.reverse();
    quads.set(local, e * 4);
  });
  return { x: Float64Array.from(xs), y: Float64Array.from(ys), quads };
}

// ---------------------------------------------------------------------------------------------
// 3D model
// ---------------------------------------------------------------------------------------------

export interface GasketPathMesh {
  quad: QuadMesh;
  cellCount: number;
  /** Per cell: gasket cell index (−1 if no gasket below), load index (−1 if none), area mm², corners' mean. */
  gasketIndex: Int32Array;
  /** Cell of each gasket cell index. */
  gasketCells: number[];
  loadIndex: Int32Array;
  areaMm2: Float64Array;
  cx: Float64Array;
  cy: Float64Array;
  /** Meshed area of each load, mm² (the pressure is the force over it, so the applied total is exact). */
  loadAreaMm2: number[];
  /** 1 where a 2D node carries a gasket cell (it then has a fixed node below). */
  gasketNode: Uint8Array;
  /** CalculiX node number of a 2D node on the plate's top face, bottom face (the gasket plane), fixed gasket face. */
  topNode: (k: number) => number;
  bottomNode: (k: number) => number;
  fixedNode: (k: number) => number;
  plateElement: (cell: number) => number;
  gasketElement: (g: number) => number;
  elementCount: number;
  nodeCount: number;
}

/** Extrudes the 2D mesh into the plate and gasket layers and classifies every cell. */
export function buildGasketPathMesh(quad: QuadMesh, problem: GasketPathProblem): GasketPathMesh {
  const nc = quad.x.length;
  const cells = quad.quads.length / 4;
  const gasketIndex = new Int32Array(cells).fill(-1);
  const loadIndex = new Int32Array(cells).fill(-1);
  const areaMm2 = new Float64Array(cells);
  const cx = new Float64Array(cells);
  const cy = new Float64Array(cells);
  const gasketCells: number[] = [];
  const gasketNode = new Uint8Array(nc);
  const loadAreaMm2 = problem.loads.map(() => 0);
  for (let e = 0; e < cells; e++) {
    let a = 0,
      sx = 0,
      sy = 0;
    for (let k = 0; k < 4; k++) {
      const p = quad.quads[e * 4 + k];
      const q = quad.quads[e * 4 + ((k + 1) % 4)];
      a += quad.x[p] * quad.y[q] - quad.x[q] * quad.y[p];
      sx += quad.x[p] / 4;
      sy += quad.y[p] / 4;
    }
    areaMm2[e] = a / 2;
    cx[e] = sx;
    cy[e] = sy;
    if (problem.isGasket(sx, sy)) {
      gasketIndex[e] = gasketCells.length;
      gasketCells.push(e);
      for (let k = 0; k < 4; k++) gasketNode[quad.quads[e * 4 + k]] = 1;
    }
    const l = problem.loads.findIndex((ld) => ld.inside(sx, sy));
    if (l >= 0) {
      loadIndex[e] = l;
      loadAreaMm2[l] += a / 2;
    }
  }
  const missing = loadAreaMm2.findIndex((a) => a <= 0);
  if (missing >= 0)
    throw new Error(`the mesh has no cell on the bearing area of ${problem.loads[missing].label}`);
  let fixedCount = 0;
  for (let k = 0; k < nc; k++) fixedCount += gasketNode[k];
  return {
    quad,
    cellCount: cells,
    gasketIndex,
    gasketCells,
    loadIndex,
    areaMm2,
    cx,
    cy,
    loadAreaMm2,
    gasketNode,
    topNode: (k) => 1 + k,
    bottomNode: (k) => 1 + nc + k,
    fixedNode: (k) => 1 + 2 * nc + k,
    plateElement: (c) => 1 + c,
    gasketElement: (g) => 1 + cells + g,
    elementCount: cells + gasketCells.length,
    nodeCount: 2 * nc + fixedCount,
  };
}

/** The CalculiX deck for one contact set (closed[g] for gasket cell g). */
export function writeGasketPathDeck(
  mesh: GasketPathMesh,
  problem: GasketPathProblem,
  closed: ArrayLike<boolean | number>,
): string {
  const { quad } = mesh;
  const nc = quad.x.length;
  const t = problem.plate.thicknessMm;
  const tg = problem.gasket.thicknessMm;
  const L: string[] = ["** Sealpitch gasket path model (features/fe-check)", "*NODE, NSET=NALL"];
  for (let k = 0; k < nc; k++) L.push(`${mesh.topNode(k)}, ${fmt(quad.x[k])}, ${fmt(quad.y[k])}, ${fmt(t)}`);
  for (let k = 0; k < nc; k++) L.push(`${mesh.bottomNode(k)}, ${fmt(quad.x[k])}, ${fmt(quad.y[k])}, 0`);
  for (let k = 0; k < nc; k++)
    if (mesh.gasketNode[k]) L.push(`${mesh.fixedNode(k)}, ${fmt(quad.x[k])}, ${fmt(quad.y[k])}, ${fmt(-tg)}`);
  const corner = (e: number) => Array.from(quad.quads.subarray(e * 4, e * 4 + 4));
  L.push("*ELEMENT, TYPE=C3D8I, ELSET=EPLATE");
  for (let e = 0; e < mesh.cellCount; e++) {
    const c = corner(e);
    L.push(`${mesh.plateElement(e)}, ${[...c.map(mesh.bottomNode), ...c.map(mesh.topNode)].join(", ")}`);
  }
  const closedIds: number[] = [];
  const openIds: number[] = [];
  if (mesh.gasketCells.length) {
    L.push("*ELEMENT, TYPE=C3D8, ELSET=EGASKET");
    mesh.gasketCells.forEach((e, g) => {
      const c = corner(e);
      L.push(`${mesh.gasketElement(g)}, ${[...c.map(mesh.fixedNode), ...c.map(mesh.bottomNode)].join(", ")}`);
      (closed[g] ? closedIds : openIds).push(mesh.gasketElement(g));
    });
  }
  if (closedIds.length) L.push("*ELSET, ELSET=ECLOSED", chunks(closedIds));
  if (openIds.length) L.push("*ELSET, ELSET=EOPEN", chunks(openIds));
  const pl = problem.plate;
  const eg = problem.gasket.modulusMpa;
  const soft = fmt(eg * GASKET_SOFT_FACTOR);
  L.push("*MATERIAL, NAME=MPLATE", "*ELASTIC", `${fmt(pl.modulusMpa)}, ${pl.poisson}`);
  L.push("*MATERIAL, NAME=MCLOSED", "*ELASTIC, TYPE=ENGINEERING CONSTANTS");
  L.push(`${soft}, ${soft}, ${fmt(eg)}, 0, 0, 0, ${soft}, ${soft},`, soft);
  L.push("*MATERIAL, NAME=MOPEN", "*ELASTIC, TYPE=ENGINEERING CONSTANTS");
  L.push(`${soft}, ${soft}, ${soft}, 0, 0, 0, ${soft}, ${soft},`, soft);
  L.push("*SOLID SECTION, ELSET=EPLATE, MATERIAL=MPLATE");
  if (closedIds.length) L.push("*SOLID SECTION, ELSET=ECLOSED, MATERIAL=MCLOSED");
  if (openIds.length) L.push("*SOLID SECTION, ELSET=EOPEN, MATERIAL=MOPEN");
  const bottomIds: number[] = [];
  const fixedIds: number[] = [];
  for (let k = 0; k < nc; k++) {
    bottomIds.push(mesh.bottomNode(k));
    if (mesh.gasketNode[k]) fixedIds.push(mesh.fixedNode(k));
  }
  L.push("*NSET, NSET=NGASKETPLANE", chunks(bottomIds));
  if (fixedIds.length) L.push("*NSET, NSET=NFIXED", chunks(fixedIds));
  // Symmetry planes: the nodes within a small tolerance of each plane (every layer).
  const layerIds = (k: number) => [
    mesh.topNode(k),
    mesh.bottomNode(k),
    ...(mesh.gasketNode[k] ? [mesh.fixedNode(k)] : []),
  ];
  let span = 1;
  for (let k = 0; k < nc; k++) span = Math.max(span, Math.abs(quad.x[k]), Math.abs(quad.y[k]));
  const tol = 1e-7 * span;
  const onPlane = problem.symmetry.map((s) => {
    const out: number[] = [];
    for (let k = 0; k < nc; k++)
      if (Math.abs((quad.x[k] - s.px) * s.nx + (quad.y[k] - s.py) * s.ny) <= tol) out.push(k);
    return out;
  });
  const count = new Uint8Array(nc);
  for (const ks of onPlane) for (const k of ks) count[k]++;
  const bc: string[] = [];
  problem.symmetry.forEach((s, i) => {
    const nodes = onPlane[i].filter((k) => count[k] === 1).flatMap(layerIds);
    if (!nodes.length) return;
    L.push(`*NSET, NSET=NSYM${i + 1}`, chunks(nodes));
    // Local x along the plane's normal: dof 1 is then the normal displacement.
    L.push(
      `*TRANSFORM, NSET=NSYM${i + 1}, TYPE=R`,
      `${fmt(s.nx)}, ${fmt(s.ny)}, 0, ${fmt(-s.ny)}, ${fmt(s.nx)}, 0`,
    );
    bc.push(`NSYM${i + 1}, 1, 1, 0.0`);
  });
  // Nodes on two planes (a sector's apex): both in-plane displacements vanish.
  const apex: number[] = [];
  for (let k = 0; k < nc; k++) if (count[k] > 1) apex.push(...layerIds(k));
  if (apex.length) {
    L.push("*NSET, NSET=NAPEX", chunks(apex));
    bc.push("NAPEX, 1, 2, 0.0");
  }
  problem.pins.forEach((pin, i) => {
    let best = 0;
    let d2 = Infinity;
    for (let k = 0; k < nc; k++) {
      const d = (quad.x[k] - pin.x) ** 2 + (quad.y[k] - pin.y) ** 2;
      if (d < d2) {
        d2 = d;
        best = k;
      }
    }
    L.push(`*NSET, NSET=NPIN${i + 1}`, `${mesh.topNode(best)}, ${mesh.bottomNode(best)}`);
    for (const dof of pin.dofs) bc.push(`NPIN${i + 1}, ${dof}, ${dof}, 0.0`);
  });
  L.push("*STEP", "*STATIC", "*BOUNDARY");
  if (fixedIds.length) L.push("NFIXED, 1, 3, 0.0");
  L.push(...bc, "*DLOAD");
  for (let e = 0; e < mesh.cellCount; e++) {
    const l = mesh.loadIndex[e];
    if (l >= 0) L.push(`${mesh.plateElement(e)}, P2, ${fmt(problem.loads[l].forceN / mesh.loadAreaMm2[l])}`);
  }
  L.push("*NODE PRINT, NSET=NGASKETPLANE", "U");
  if (fixedIds.length) L.push("*NODE PRINT, NSET=NFIXED, TOTALS=ONLY", "RF");
  L.push("*END STEP");
  return L.join("\n") + "\n";
}
