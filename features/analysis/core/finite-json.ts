/**
 * Deep copy into plain JSON data: typed arrays become arrays and any non-finite number becomes
 * null, counted, so a result can never carry NaN or Infinity. The count is reported by the
 * caller; tests assert it stays zero.
 */
export function toFiniteJson<T>(value: T): { value: T; replaced: number } {
  let replaced = 0;
  const walk = (v: unknown): unknown => {
    if (typeof v === "number") {
      if (Number.isFinite(v)) return v;
      replaced++;
      return null;
    }
    if (v === null || typeof v !== "object") return v;
    if (ArrayBuffer.isView(v)) return Array.from(v as unknown as ArrayLike<number>, (x) => walk(x));
    if (Array.isArray(v)) return v.map(walk);
    const out: Record<string, unknown> = {};
    for (const [k, x] of Object.entries(v as Record<string, unknown>)) if (x !== undefined) out[k] = walk(x);
    return out;
  };
  return { value: walk(value) as T, replaced };
}
