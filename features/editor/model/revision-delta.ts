/**
 * What changed between two revisions of a design, said the way the Joint data form says it: the
 * changed inputs under the form's own labels and in the design's display units, and what happened
 * to the bolt pattern as a whole ("pattern turned 15° clockwise", "2 bolts added"). Pure; the
 * revision comparison page draws it (features/editor/components/revision-overlay.tsx).
 */
import { BOLT_MATERIALS } from "@/features/analysis/core/catalogue/bolt-materials";
import { TIGHTENING_METHODS } from "@/features/analysis/core/catalogue/tightening-methods";
import type { JointDesign, Outline, UnitSystem } from "@/features/analysis/core/design";
import { getDesignBoltPath, wrapArc } from "./bolt-path";
import { FIELD_SPECS, layerModulusSpec, layerThicknessSpec } from "./field-specs";
import { formatQuantity, type Quantity } from "./quantities";

export interface InputChange {
  /** Stable key (the field's place in the design); never shown. */
  key: string;
  label: string;
  before: string;
  after: string;
}

type Labelled = { label: string; quantity?: Quantity; words?: (v: unknown) => string };

const materialName = (v: unknown) => BOLT_MATERIALS.find((m) => m.id === v)?.name ?? String(v);
const methodName = (v: unknown) => TIGHTENING_METHODS.find((m) => m.id === v)?.name ?? String(v);
const WORDS: Record<string, string> = {
  stud: "Stud (threaded full length)",
  "hex-bolt": "Hex bolt",
  rigid: "Rigid (flat bearing face)",
  flexible: "Flexible (uniform pressure)",
  "fraction-of-proof": "Fraction of proof load",
  "fraction-of-yield": "Fraction of yield",
  "bolt-stress": "Bolt stress",
  "thickness-dependent": "Thickness-dependent",
  fixed: "Fixed angle",
  auto: "Choose by stiffness",
  cone: "Cone superposition",
  beam: "Beam on elastic foundation",
  ring: "Ring",
  "full-face": "Full face",
  nut: "Nut",
  "tapped-hole": "Tapped hole",
  "iso-4032": "ISO 4032",
  "iso-old": "ISO (old widths)",
};
const word = (v: unknown) => (typeof v === "string" ? (WORDS[v] ?? v) : String(v));

// The form's own fields (field-specs.ts), then the choices and the geometry that the form,
// the templates and the drawing set.
const LABELS: Record<string, Labelled> = {
  ...Object.fromEntries(
    Object.values(FIELD_SPECS)
      .filter((s) => s.path !== "bolts")
      .map((s) => [s.path, { label: s.label, quantity: s.quantity }]),
  ),
  name: { label: "Name" },
  description: { label: "Service / notes" },
  "gasket.kind": { label: "Gasket form", words: word },
  "gasket.material.name": { label: "Gasket material" },
  "gasket.material.m": { label: "Gasket factor m", quantity: "ratio" },
  "gasket.material.yMpa": { label: "Seating stress y", quantity: "stress" },
  "gasket.material.source": { label: "Gasket data source" },
  "gasket.geometry.kind": { label: "Gasket shape", words: word },
  "fastener.designation": { label: "Bolt size" },
  "fastener.threadSeries": { label: "Thread series" },
  "fastener.materialId": { label: "Bolt material", words: materialName },
  "fastener.form": { label: "Bolt form", words: word },
  "fastener.washerActsAs": { label: "Washer acts as", words: word },
  "fastener.nutSeries": { label: "Nut widths", words: word },
  "fastener.termination.kind": { label: "Nut or tapped hole", words: word },
  "fastener.enteredAllowable.valueMpa": { label: "Allowable bolt stress, entered", quantity: "stress" },
  "fastener.enteredAllowable.source": { label: "Source of the bolt allowable" },
  "assembly.method": { label: "Tightening method", words: methodName },
  "assembly.preload.kind": { label: "Preload rule", words: word },
  "assembly.nutFactor.source": { label: "Nut factor source" },
  "estimator.coneAngle.mode": { label: "Cone angle", words: word },
  "estimator.estimator": { label: "Gasket stress estimate", words: word },
  "boltPath.kind": {
    label: "Bolt path",
    words: (v) => (v === "circle" ? "Bolt circle" : "Offset from the edge"),
  },
  "boltPath.diameterMm": { label: "Bolt circle diameter", quantity: "length" },
  "boltPath.offsetMm": { label: "Bolt path offset from the edge", quantity: "length" },
  "loads.designPressureMpa": { label: "Design pressure", quantity: "stress" },
};

function outlineWords(o: Outline | null | undefined, units: UnitSystem): string {
  if (!o) return "none";
  const len = (v: number) => formatQuantity("length", v, units);
  switch (o.kind) {
    case "circle":
      return `circle Ø ${len(o.diameterMm)}`;
    case "rectangle":
      return `rectangle ${len(o.widthMm)} × ${len(o.heightMm)}, corners R ${len(o.cornerRadiusMm)}`;
    case "obround":
      return `obround ${len(o.lengthMm)} × ${len(o.widthMm)}`;
    case "polygon":
      return `drawn outline, ${o.points.length} corners`;
  }
}

// A field nobody has labelled still reads as words: "gasket.material.qMinMpa" → "Gasket material q min".
function fallbackLabel(key: string): string {
  const words = key
    .replace(/\[\d+\]|\.\d+/g, "")
    .replace(/(Mm|Mpa|Nmm|N|C|Deg)$/u, "")
    .split(".")
    .flatMap((part) => part.replace(/([a-z])([A-Z])/g, "$1 $2").toLowerCase())
    .join(" ");
  return words.charAt(0).toUpperCase() + words.slice(1);
}

function quantityOfKey(key: string): Quantity | undefined {
  if (/Mm$/.test(key)) return "length";
  if (/Mpa$/.test(key)) return "stress";
  if (/Nmm$/.test(key)) return "moment";
  if (/N$/.test(key)) return "force";
  if (/C$/.test(key)) return "temperature";
  if (/Deg(rees)?$/.test(key)) return "angle";
  return undefined;
}

function leaves(v: unknown, key: string, out: Map<string, unknown>): void {
  if (key === "bolts" || key === "outline" || key === "bore") return;
  if (v !== null && typeof v === "object" && !Array.isArray(v)) {
    for (const [k, x] of Object.entries(v)) leaves(x, key ? `${key}.${k}` : k, out);
    return;
  }
  if (Array.isArray(v) && key === "layers") {
    v.forEach((x, i) => leaves(x, `layers.${i}`, out));
    return;
  }
  out.set(key, v);
}

function show(value: unknown, l: Labelled, key: string, units: UnitSystem): string {
  if (value === undefined || value === null || value === "") return "—";
  if (l.words) return l.words(value);
  if (typeof value === "number") {
    const q = l.quantity ?? quantityOfKey(key);
    return q && q !== "count" ? formatQuantity(q, value, units) : String(Number(value.toPrecision(4)));
  }
  if (typeof value === "boolean") return value ? "yes" : "no";
  if (typeof value === "string") return word(value);
  return Array.isArray(value) ? `${value.length} entries` : "set";
}

function labelFor(key: string, design: JointDesign): Labelled {
  const layer = /^layers\.(\d+)\.(\w+)$/.exec(key);
  if (layer) {
    const i = Number(layer[1]);
    const plate = design.layers.slice(0, i + 1).filter((l) => l.role !== "gasket").length;
    const base =
      layer[2] === "thicknessMm"
        ? layerThicknessSpec(i)
        : layer[2] === "modulusMpa"
          ? layerModulusSpec(i)
          : { label: layer[2] === "materialName" ? "Flange material name" : fallbackLabel(layer[2]) };
    return { ...base, label: `${base.label}, plate ${plate}` };
  }
  return LABELS[key] ?? { label: fallbackLabel(key) };
}

/** Every input that differs, labelled as in the form, shown in the after revision's units. Bolt positions are the pattern's (see summarisePattern). */
export function describeInputChanges(before: JointDesign, after: JointDesign): InputChange[] {
  const units = after.units;
  const changes: InputChange[] = [];
  for (const [key, label] of [
    ["outline", "Flange outline"],
    ["bore", "Bore"],
  ] as const) {
    const a = outlineWords(before[key], units);
    const b = outlineWords(after[key], units);
    if (JSON.stringify(before[key] ?? null) !== JSON.stringify(after[key] ?? null))
      changes.push({ key, label, before: a, after: b });
  }
  const a = new Map<string, unknown>();
  const b = new Map<string, unknown>();
  leaves(before, "", a);
  leaves(after, "", b);
  for (const key of [...new Set([...a.keys(), ...b.keys()])]) {
    if (key === "schemaVersion" || key === "units") continue;
    if (JSON.stringify(a.get(key) ?? null) === JSON.stringify(b.get(key) ?? null)) continue;
    const l = labelFor(key, b.has(key) ? after : before);
    changes.push({
      key,
      label: l.label,
      before: show(a.get(key), l, key, units),
      after: show(b.get(key), l, key, units),
    });
  }
  if (before.units !== after.units)
    changes.push({ key: "units", label: "Units", before: before.units, after: after.units });
  return changes;
}

const plural = (n: number, one: string, many = `${one}s`) => `${n} ${n === 1 ? one : many}`;
const num = (v: number, digits = 3) => String(Number(v.toPrecision(digits)));

/**
 * Pattern-level sentences: bolts added or removed, the bolt circle or path offset changing, the
 * whole pattern turned along its path (every kept bolt moved by the same share of the path), or
 * how many bolts moved on their own.
 */
export function summarisePattern(before: JointDesign, after: JointDesign): string[] {
  const out: string[] = [];
  const units = after.units;
  const len = (v: number) => formatQuantity("length", v, units);
  const beforeIds = new Set(before.bolts.map((b) => b.id));
  const afterIds = new Set(after.bolts.map((b) => b.id));
  const added = after.bolts.filter((b) => !beforeIds.has(b.id)).length;
  const removed = before.bolts.filter((b) => !afterIds.has(b.id)).length;
  if (added > 0) out.push(`${plural(added, "bolt")} added`);
  if (removed > 0) out.push(`${plural(removed, "bolt")} removed`);
  if (added !== removed) out.push(`bolt count ${before.bolts.length} → ${after.bolts.length}`);

  const p = before.boltPath;
  const q = after.boltPath;
  if (p.kind === "circle" && q.kind === "circle" && p.diameterMm !== q.diameterMm) {
    const d = q.diameterMm - p.diameterMm;
    out.push(`bolt circle ${len(Math.abs(d))} ${d > 0 ? "larger" : "smaller"}`);
  } else if (p.kind === "offset" && q.kind === "offset" && p.offsetMm !== q.offsetMm) {
    const d = q.offsetMm - p.offsetMm;
    out.push(`bolt path ${len(Math.abs(d))} ${d > 0 ? "further in from" : "closer to"} the edge`);
  } else if (p.kind !== q.kind) {
    out.push(q.kind === "circle" ? "bolts now on a bolt circle" : "bolts now on a path offset from the edge");
  }

  // Shares of the path (s / L) so that a bigger bolt circle with the same angles reads as no turn.
  const la = getDesignBoltPath(before).lengthMm;
  const lb = getDesignBoltPath(after).lengthMm;
  const beforeById = new Map(before.bolts.map((b) => [b.id, b]));
  const turns: number[] = [];
  let radial = 0;
  for (const b of after.bolts) {
    const a = beforeById.get(b.id);
    if (!a) continue;
    let t = wrapArc(b.sMm, lb) / lb - wrapArc(a.sMm, la) / la;
    t -= Math.round(t);
    turns.push(t);
    if ((a.offPathMm ?? 0) !== (b.offPathMm ?? 0)) radial++;
  }
  const eps = 1e-6;
  const moving = turns.filter((t) => Math.abs(t) > eps);
  const uniform =
    turns.length > 1 && moving.length === turns.length && turns.every((t) => Math.abs(t - turns[0]) < eps);
  if (uniform) {
    const deg = turns[0] * 360;
    const arc = Math.abs(turns[0]) * lb;
    out.push(
      q.kind === "circle"
        ? `pattern turned ${num(Math.abs(deg))}° ${deg > 0 ? "clockwise" : "anticlockwise"}`
        : `pattern moved ${len(arc)} ${deg > 0 ? "clockwise" : "anticlockwise"} along the bolt path`,
    );
  } else if (moving.length > 0) {
    out.push(`${plural(moving.length, "bolt")} moved along the bolt path`);
  }
  if (radial > 0) out.push(`${plural(radial, "bolt")} moved off or back onto the path`);
  return out;
}
