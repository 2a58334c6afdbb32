/**
 * Deep copy into plain JSON data: typed arrays become arrays and any non-finite number becomes
 * null, counted, so a result can never carry NaN or Infinity. The count is reported by the
 * caller; tests assert it stays zero.
 */
export function toFiniteJson<T>(value: T): { value: T; replaced: number } {
  let replaced = 0;
  // Loops rather than map/Array.from/Object.entries: the same copy (holes stay holes, keys keep
  // their order), without a callback per element of the 6 000-sample profiles.
  const walk = (v: unknown): unknown => {
    if (typeof v === "number") {
      if (Number.isFinite(v)) return v;
      replaced++;
      return null;
    }
    if (v === null || typeof v !== "object") return v;
    if (ArrayBuffer.isView(v) && !(v instanceof DataView)) {
      const a = v as unknown as ArrayLike<number>;
      const out = new Array<unknown>(a.length);
      for (let i = 0; i < a.length; i++) out[i] = walk(a[i]);
      return out;
    }
    if (Array.isArray(v)) {
      const out = new Array<unknown>(v.length);
      for (let i = 0; i < v.length; i++) {
        const x: unknown = v[i];
        if (typeof x === "number" && Number.isFinite(x)) out[i] = x;
        else if (x !== undefined || i in v) out[i] = walk(x);
      }
      return out;
    }
    const out: Record<string, unknown> = {};
    const o = v as Record<string, unknown>;
    for (const k of Object.keys(o)) {
      const x = o[k];
      if (x !== undefined) out[k] = walk(x);
    }
    return out;
  };
  return { value: walk(value) as T, replaced };
}

/**
 * `toFiniteJson` for a list of flat records (fields that are numbers, strings, booleans, null or
 * arrays of those), as check records are: the same result without the general walk, for the
 * editor's per-frame preview. Nested objects fall back to `toFiniteJson`.
 *
 * Example: `toFiniteRecords([{ value: NaN, subject: ["b1"] }]).value` → `[{ value: null, subject: ["b1"] }]`.
 */
export function toFiniteRecords<T extends object>(records: readonly T[]): { value: T[]; replaced: number } {
  let replaced = 0;
  const num = (x: number) => {
    if (Number.isFinite(x)) return x;
    replaced++;
    return null;
  };
  const value = records.map((r) => {
    const out: Record<string, unknown> = {};
    for (const k in r) {
      const x = (r as Record<string, unknown>)[k];
      if (x === undefined) continue;
      if (typeof x === "number") out[k] = num(x);
      else if (x === null || typeof x !== "object") out[k] = x;
      else if (Array.isArray(x) && x.every((e) => e === null || typeof e !== "object"))
        out[k] = x.map((e) => (typeof e === "number" ? num(e) : e));
      else {
        const deep = toFiniteJson(x);
        replaced += deep.replaced;
        out[k] = deep.value;
      }
    }
    return out as T;
  });
  return { value, replaced };
}

/** `Array.from(on, (v) => v === 1)` as a loop (the per-element callback is most of its cost). */
export function onGasketFlags(on: Uint8Array): boolean[] {
  const out = new Array<boolean>(on.length);
  for (let i = 0; i < on.length; i++) out[i] = on[i] === 1;
  return out;
}
