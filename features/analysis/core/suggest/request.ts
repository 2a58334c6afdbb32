/**
 * The pattern search's request: the design (outline, gasket, layers, service, tightening as
 * entered), the bolt sizes and materials allowed, an optional range of bolt-path offsets and the
 * layout constraints. `checkSuggestionRequest` lists every problem (path and message), like
 * `validateJointDesign`; an empty list means the search can run. Lengths in mm.
 */
import type {
  BoltPath,
  BoltPlacement,
  Fastener,
  JointDesign,
  StockedBoltMaterial,
  ThreadSeries,
  UnitSystem,
} from "../design";
import { MAX_BOLT_COUNT } from "../design";
import { findThread, type ThreadRow, THREADS } from "../catalogue/threads";
import { getBoltMaterialById } from "../catalogue/bolt-materials";
import { getBoltPath, projectOntoPath, getBoltPoint } from "../geometry";
import { validateJointDesign, validateStockedMaterial, type DesignIssue } from "../validate";
import { inToMm } from "../units";
import { intervalLengthMm, inInterval, widenAndMerge, type PathInterval } from "./layout";

/** A stretch of the bolt path that must stay free of bolt holes (nozzle, hinge, lifting lug). */
export type KeepOutZone =
  /** Arc length on the design's bolt path, clockwise from `fromMm` to `toMm` (wraps over s = 0). */
  | { kind: "arc-length"; fromMm: number; toMm: number; label?: string }
  /** Path parameter, 0…1 of the path length from the top centre line, clockwise. */
  | { kind: "parameter"; from: number; to: number; label?: string };

/** A Stockroom bolting row offered to the search: its id (the fastener's `materialId` once applied) and its values as stored. */
export interface StockedBoltingRow {
  id: string;
  material: StockedBoltMaterial;
}

export interface SuggestionRequest {
  design: JointDesign;
  /** Allowed sizes; default every catalogue size of the design's thread family (metric or inch). */
  sizes?: { designation: string; threadSeries: ThreadSeries }[];
  /**
   * Allowed bolt materials: catalogue ids or ids of `stockedBolting` rows. Default: every
   * `stockedBolting` row when there are any, else the design's own material.
   */
  materialIds?: string[];
  /**
   * The Stockroom's bolting rows the search may use, with their properties as stored (the API
   * resolves them from the caller's organisation; the CLI reads them from an export file). A
   * candidate of such a row carries a copy of it in `fastener.stockedMaterial`.
   */
  stockedBolting?: StockedBoltingRow[];
  /** Unit system of the lengths in the result's sentences (blocking reasons, message); numbers stay mm. Default SI. */
  units?: UnitSystem;
  /**
   * Bolt-path offsets inward from the outline to try, mm: an offset path's `offsetMm`, or for a
   * bolt circle on a circular outline (outline diameter − bolt circle)/2. Default: the design's.
   */
  offsetRangeMm?: { fromMm: number; toMm: number; stepMm: number } | null;
  keepOuts?: KeepOutZone[];
  /** Ids of bolts of the design that must stay where they are. */
  fixedBoltIds?: string[];
  /**
   * Circular pipe flanges only: the bolt count a multiple of 4 with holes straddling both centre
   * lines (default true there). False lets those pattern rules warn.
   */
  straddleCentreLines?: boolean;
  /**
   * Let layout rules warn (pitch beyond 2a + t or outside 3–6 d, an edge distance short of the nut):
   * such warnings are then carried with the candidate instead of ruling it out. Default false.
   */
  allowLayoutWarnings?: boolean;
  /** Extra room around the tool beyond the core's tool clearance rule, mm (default 0). */
  minToolClearanceMm?: number;
  /** Work cap: full analyses the search may run (default 600, at most 2000). */
  maxAnalyses?: number;
}

export const SUGGESTION_LIMITS = {
  sizes: 40,
  materials: 8,
  stockedRows: 200,
  offsets: 21,
  keepOuts: 32,
  combinations: 400,
  maxAnalyses: 2000,
  defaultAnalyses: 600,
  toolClearanceMm: 200,
} as const;

/** The search's own frame for one offset: the bolt path and where fixed bolts and keep-outs fall on it. */
export interface OffsetFrame {
  offsetMm: number | null;
  boltPath: BoltPath;
  pathLengthMm: number;
  fixed: BoltPlacement[];
  /** Keep-outs as fractions of the path length (not yet widened by the hole). */
  keepOutFractions: PathInterval[];
}

export function isPipeFlange(design: JointDesign): boolean {
  return design.outline.kind === "circle" && design.boltPath.kind === "circle" && design.bore !== null;
}

/** The design's own offset inward from the outline, or null when the path has none. */
export function currentOffsetMm(design: JointDesign): number | null {
  if (design.boltPath.kind === "offset") return design.boltPath.offsetMm;
  if (design.outline.kind === "circle") return (design.outline.diameterMm - design.boltPath.diameterMm) / 2;
  return null;
}

function boltPathAt(design: JointDesign, offsetMm: number): BoltPath {
  if (design.boltPath.kind === "offset") return { kind: "offset", offsetMm };
  const od = design.outline.kind === "circle" ? design.outline.diameterMm : 0;
  return { kind: "circle", diameterMm: od - 2 * offsetMm };
}

/** The offsets of the request, ascending (the design's own when no range is given). */
export function offsetsOf(req: SuggestionRequest): (number | null)[] {
  const r = req.offsetRangeMm;
  if (!r) return [currentOffsetMm(req.design)];
  const out: number[] = [];
  for (let k = 0; k <= SUGGESTION_LIMITS.offsets; k++) {
    const v = r.fromMm + k * r.stepMm;
    if (v > r.toMm + 1e-9) break;
    out.push(Math.round(v * 1e6) / 1e6);
  }
  return out;
}

export function sizesOf(req: SuggestionRequest): ThreadRow[] {
  const f = req.design.fastener;
  const rows = req.sizes
    ? req.sizes.map((s) => findThread(s.designation, s.threadSeries)).filter((t): t is ThreadRow => !!t)
    : THREADS.filter((t) => (t.series === "metric-coarse") === (f.threadSeries === "metric-coarse"));
  const seen = new Set<string>();
  return rows
    .filter((t) => !seen.has(t.id) && seen.add(t.id))
    .sort((a, b) => a.nominalDiameterMm - b.nominalDiameterMm);
}

export function materialsOf(req: SuggestionRequest): string[] {
  const stocked = req.stockedBolting ?? [];
  return [
    ...new Set(
      req.materialIds ?? (stocked.length > 0 ? stocked.map((r) => r.id) : [req.design.fastener.materialId]),
    ),
  ];
}

/**
 * The Stockroom values behind a material id of the request: a `stockedBolting` row, or the
 * design's own Stockroom copy; null for a catalogue material; undefined for an unknown id.
 */
export function stockedMaterialFor(
  req: SuggestionRequest,
  id: string,
): StockedBoltMaterial | null | undefined {
  const row = req.stockedBolting?.find((r) => r.id === id);
  if (row) return row.material;
  const f = req.design.fastener;
  if (f.stockedMaterial && f.materialId === id) return f.stockedMaterial;
  return getBoltMaterialById(id) ? null : undefined;
}

/** Keep-out zones as fractions of the design's bolt path length. */
function keepOutFractions(req: SuggestionRequest, L: number): PathInterval[] {
  return (req.keepOuts ?? []).map((z) =>
    z.kind === "parameter" ? { fromMm: z.from, toMm: z.to } : { fromMm: z.fromMm / L, toMm: z.toMm / L },
  );
}

/** The frame of one offset: fixed bolts keep their points (s and off-path distance on the new path). */
export function frameFor(req: SuggestionRequest, offsetMm: number | null): OffsetFrame {
  const d = req.design;
  const boltPath = offsetMm === null ? d.boltPath : boltPathAt(d, offsetMm);
  const own = getBoltPath(d.outline, d.boltPath);
  const path = getBoltPath(d.outline, boltPath);
  const ids = new Set(req.fixedBoltIds ?? []);
  const fixed = d.bolts
    .filter((b) => ids.has(b.id))
    .map((b) => {
      if (offsetMm === currentOffsetMm(d)) return { ...b };
      const p = projectOntoPath(path, getBoltPoint(own, b));
      return { id: b.id, sMm: p.sMm, offPathMm: p.offPathMm };
    });
  return {
    offsetMm,
    boltPath,
    pathLengthMm: path.lengthMm,
    fixed,
    keepOutFractions: keepOutFractions(req, own.lengthMm),
  };
}

/** Keep-outs on the frame's path in mm, widened by half the hole so no hole edge enters them. */
export function keepOutsMm(frame: OffsetFrame, holeDiameterMm: number): PathInterval[] {
  const L = frame.pathLengthMm;
  const zones = frame.keepOutFractions.map((z) => ({ fromMm: z.fromMm * L, toMm: z.toMm * L }));
  return zones.length === 0 ? [] : widenAndMerge(zones, holeDiameterMm / 2, L);
}

/** Clearance hole for a size: ISO 273 medium ≈ d + 2 mm (d ≤ 24) or d + 3 mm; inch d + 1/8 in [practice]. */
export function clearanceHoleMm(t: ThreadRow): number {
  return t.series === "metric-coarse"
    ? t.nominalDiameterMm + (t.nominalDiameterMm <= 24 ? 2 : 3)
    : t.nominalDiameterMm + inToMm(0.125);
}

/** The fastener made of another material: a catalogue id, or a Stockroom row whose copy it then carries. */
function withMaterial(f: Fastener, materialId: string, stocked: StockedBoltMaterial | null): Fastener {
  const { stockedMaterial: _copy, ...rest } = f;
  return stocked ? { ...rest, materialId, stockedMaterial: stocked } : { ...rest, materialId };
}

/**
 * The design's fastener in another size and material: the design's own size keeps its hole and
 * washer; another size gets its clearance hole and the washer scaled with d. The length is set
 * later from the grip (see search.ts). `stocked`: the Stockroom row behind `materialId` (null:
 * a catalogue material).
 */
export function fastenerFor(
  f: Fastener,
  t: ThreadRow,
  materialId: string,
  stocked: StockedBoltMaterial | null = null,
): Fastener {
  const own = findThread(f.designation, f.threadSeries);
  if (own?.id === t.id) return withMaterial(f, materialId, stocked);
  const scale = t.nominalDiameterMm / (own?.nominalDiameterMm ?? t.nominalDiameterMm);
  const hole = clearanceHoleMm(t);
  const washer = f.washer
    ? {
        thicknessMm: Math.round(f.washer.thicknessMm * scale * 10) / 10,
        outerDiameterMm: Math.max(Math.round(f.washer.outerDiameterMm * scale), Math.ceil(hole) + 4),
      }
    : null;
  return {
    ...withMaterial(f, materialId, stocked),
    designation: t.designation,
    threadSeries: t.series,
    holeDiameterMm: hole,
    washer,
    enteredAllowable: materialId === f.materialId ? f.enteredAllowable : null,
  };
}

/** Every problem of the request; empty when the search can run. */
export function checkSuggestionRequest(req: SuggestionRequest): DesignIssue[] {
  const issues: DesignIssue[] = validateJointDesign(req.design).map((i) => ({
    path: `design.${i.path}`,
    message: i.message,
  }));
  if (issues.length > 0) return issues;
  const add = (path: string, message: string) => issues.push({ path, message });
  const L = getBoltPath(req.design.outline, req.design.boltPath).lengthMm;
  const lim = SUGGESTION_LIMITS;
  if (req.sizes) {
    if (req.sizes.length === 0 || req.sizes.length > lim.sizes)
      add("sizes", `give between 1 and ${lim.sizes} bolt sizes`);
    req.sizes.forEach((s, i) => {
      if (!findThread(s.designation, s.threadSeries))
        add(`sizes[${i}]`, `no ${s.threadSeries} thread "${s.designation}" in the thread catalogue`);
    });
  }
  const stocked = req.stockedBolting ?? [];
  if (stocked.length > lim.stockedRows)
    add("stockedBolting", `at most ${lim.stockedRows} Stockroom bolting rows`);
  const stockedIds = new Set<string>();
  stocked.forEach((r, i) => {
    if (getBoltMaterialById(r.id))
      add(`stockedBolting[${i}].id`, `"${r.id}" is a catalogue material; give the Stockroom row its own id`);
    else if (stockedIds.has(r.id)) add(`stockedBolting[${i}].id`, `the id "${r.id}" is given twice`);
    stockedIds.add(r.id);
    issues.push(...validateStockedMaterial(r.material, `stockedBolting[${i}].material`));
  });
  const chosen = materialsOf(req);
  const chosenPath = req.materialIds ? "materialIds" : "stockedBolting";
  if (chosen.length === 0 || chosen.length > lim.materials)
    add(chosenPath, `give between 1 and ${lim.materials} bolt materials`);
  if (req.materialIds)
    req.materialIds.forEach((id, i) => {
      if (stockedMaterialFor(req, id) === undefined)
        add(`materialIds[${i}]`, `unknown bolt material "${id}"`);
    });
  const r = req.offsetRangeMm;
  if (r) {
    if (currentOffsetMm(req.design) === null)
      add(
        "offsetRangeMm",
        "an offset range needs an offset bolt path or a bolt circle on a circular outline",
      );
    if (!(r.stepMm > 0)) add("offsetRangeMm.stepMm", "must be greater than 0 mm");
    else if (!(r.toMm >= r.fromMm)) add("offsetRangeMm.toMm", "must not be below the start of the range");
    else if ((r.toMm - r.fromMm) / r.stepMm > lim.offsets - 1 + 1e-9)
      add("offsetRangeMm", `at most ${lim.offsets} offsets (widen the step)`);
    else if (!(r.fromMm > 0)) add("offsetRangeMm.fromMm", "must be greater than 0 mm");
  }
  const zones = keepOutFractions(req, L);
  if (zones.length > lim.keepOuts) add("keepOuts", `at most ${lim.keepOuts} keep-out zones`);
  zones.forEach((z, i) => {
    for (const [k, v] of [
      ["from", z.fromMm],
      ["to", z.toMm],
    ] as const)
      if (!(v >= 0 && v <= 1))
        add(
          `keepOuts[${i}].${k}`,
          "must lie on the bolt path (0 to the path length, or 0 to 1 as a parameter)",
        );
  });
  const zonesMm = zones.map((z) => ({ fromMm: z.fromMm * L, toMm: z.toMm * L }));
  if (zonesMm.length > 0 && issues.length === 0) {
    const merged = widenAndMerge(zonesMm, 0, L);
    if (merged.length === 1 && intervalLengthMm(merged[0], L) >= L - 1e-6)
      add("keepOuts", "the keep-out zones cover the whole bolt path");
  }
  const ids = new Set(req.design.bolts.map((b) => b.id));
  (req.fixedBoltIds ?? []).forEach((id, i) => {
    if (!ids.has(id)) add(`fixedBoltIds[${i}]`, `no bolt "${id}" in the design`);
    const b = req.design.bolts.find((x) => x.id === id);
    if (b && zonesMm.some((z) => inInterval(b.sMm, z, L)))
      add(`fixedBoltIds[${i}]`, `bolt ${id} is fixed inside a keep-out zone`);
  });
  if ((req.fixedBoltIds ?? []).length > MAX_BOLT_COUNT) add("fixedBoltIds", "too many fixed bolts");
  const c = req.minToolClearanceMm;
  if (c !== undefined && !(c >= 0 && c <= lim.toolClearanceMm))
    add("minToolClearanceMm", `must be from 0 mm to ${lim.toolClearanceMm} mm`);
  const m = req.maxAnalyses;
  if (m !== undefined && !(Number.isInteger(m) && m >= 1 && m <= lim.maxAnalyses))
    add("maxAnalyses", `must be a whole number from 1 to ${lim.maxAnalyses} (the work cap of one search)`);
  if (issues.length === 0) {
    const combos = sizesOf(req).length * materialsOf(req).length * offsetsOf(req).length;
    if (combos > lim.combinations)
      add(
        "sizes",
        `${combos} combinations of size, material and offset, over the limit of ${lim.combinations}; allow fewer`,
      );
  }
  return issues;
}
