import type { JointDesign } from "@/features/analysis/core/design";

/**
 * Sets one value of the design by a dotted path ("loads.designPressureMpa", "layers.0.thicknessMm"),
 * copying only the objects along the path. Callers validate the value first (see field-specs.ts):
 * this step never checks engineering sense, only that the path exists.
 */
export function setField(design: JointDesign, path: string, value: unknown): JointDesign {
  const keys = path.split(".");
  if (
    keys.length === 0 ||
    keys.some((k) => k === "" || k === "__proto__" || k === "constructor" || k === "prototype")
  )
    return design;
  const out = setIn(design, keys, value);
  // The path is dynamic, so the copy's type is asserted: only the value at the path changed.
  return out === null ? design : (out as JointDesign);
}

function setIn(obj: unknown, keys: string[], value: unknown): unknown | null {
  if (keys.length === 0) return value;
  if (obj === null || typeof obj !== "object") return null;
  const [k, ...rest] = keys;
  if (Array.isArray(obj)) {
    const i = Number(k);
    if (!Number.isInteger(i) || i < 0 || i >= obj.length) return null;
    const next = setIn(obj[i], rest, value);
    if (next === null) return null;
    if (Object.is(next, obj[i])) return obj;
    const copy = obj.slice();
    copy[i] = next;
    return copy;
  }
  const rec = obj as Record<string, unknown>;
  if (rest.length > 0 && !(k in rec)) return null;
  const next = setIn(rec[k], rest, value);
  if (next === null && rest.length > 0) return null;
  if (Object.is(next, rec[k]) && k in rec) return obj;
  return { ...rec, [k]: next };
}
