/**
 * Structural equality of two analysis results as JSON values. The stored result comes back from
 * PostgreSQL jsonb, which reorders object keys, so a string comparison would report false
 * differences; numbers must match exactly (the browser and the server run the same core).
 * Returns the first differing path, or null when they agree.
 */
export function firstDifference(a: unknown, b: unknown, path = "$"): string | null {
  if (a === b) return null;
  if (typeof a === "number" && typeof b === "number") return a === b ? null : path;
  if (a === null || b === null || typeof a !== "object" || typeof b !== "object") return path;
  if (Array.isArray(a) !== Array.isArray(b)) return path;
  if (Array.isArray(a) && Array.isArray(b)) {
    if (a.length !== b.length) return `${path}.length`;
    for (let i = 0; i < a.length; i++) {
      const d = firstDifference(a[i], b[i], `${path}[${i}]`);
      if (d) return d;
    }
    return null;
  }
  const ao = a as Record<string, unknown>;
  const bo = b as Record<string, unknown>;
  const keys = new Set([...Object.keys(ao), ...Object.keys(bo)]);
  for (const k of keys) {
    // JSON drops undefined members, so a missing key equals an undefined one.
    if (ao[k] === undefined && bo[k] === undefined) continue;
    const d = firstDifference(ao[k], bo[k], `${path}.${k}`);
    if (d) return d;
  }
  return null;
}
