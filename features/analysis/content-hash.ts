import { createHash } from "node:crypto";

// The frozen snapshot's fingerprint. Canonical JSON: object keys sorted (code-point order),
// arrays kept in order, `undefined` members dropped and non-finite numbers written as null (what
// JSON.stringify does), no whitespace. Because PostgreSQL's jsonb reorders keys and drops
// duplicate ones, hashing the canonical form is what makes a value hash the same before it is
// written and after it is read back. Pure; the PDF and export code reuse it.

/** Canonical JSON text of a JSON-compatible value. Example: canonicalJson({b: 1, a: [2, {d: 0, c: null}]}) === '{"a":[2,{"c":null,"d":0}],"b":1}' */
export function canonicalJson(value: unknown): string {
  if (value === null || typeof value !== "object") {
    const text = JSON.stringify(value);
    return text === undefined ? "null" : text;
  }
  if (Array.isArray(value)) {
    return `[${value.map((item) => (item === undefined || typeof item === "function" ? "null" : canonicalJson(item))).join(",")}]`;
  }
  if (typeof (value as { toJSON?: unknown }).toJSON === "function") {
    return canonicalJson((value as { toJSON: () => unknown }).toJSON());
  }
  const entries = Object.keys(value)
    .filter((key) => {
      const member = (value as Record<string, unknown>)[key];
      return member !== undefined && typeof member !== "function";
    })
    .sort()
    .map((key) => `${JSON.stringify(key)}:${canonicalJson((value as Record<string, unknown>)[key])}`);
  return `{${entries.join(",")}}`;
}

export interface SnapshotParts {
  document: unknown;
  result: unknown;
  coreVersion: string;
}

/** sha-256 (lower-case hex) of canonicalJson({ document, result, coreVersion }). */
export function computeContentHash(snapshot: SnapshotParts): string {
  const text = canonicalJson({
    document: snapshot.document,
    result: snapshot.result,
    coreVersion: snapshot.coreVersion,
  });
  return createHash("sha256").update(text, "utf8").digest("hex");
}

export type SnapshotIntegrity =
  | { state: "not-frozen" }
  | { state: "intact"; storedHash: string }
  | { state: "mismatch"; storedHash: string | null; recomputedHash: string };

/** Recomputes the hash of a stored snapshot and compares it with the stored one. */
export function verifySnapshot(stored: {
  document: unknown;
  result: unknown;
  coreVersion: string | null;
  contentHash: string | null;
}): SnapshotIntegrity {
  const recomputedHash = computeContentHash({
    document: stored.document,
    result: stored.result,
    coreVersion: stored.coreVersion ?? "",
  });
  if (stored.contentHash !== null && stored.contentHash === recomputedHash)
    return { state: "intact", storedHash: stored.contentHash };
  return { state: "mismatch", storedHash: stored.contentHash, recomputedHash };
}

/** The sentence every screen shows for a mismatch (never hidden, never softened). */
export function describeIntegrity(integrity: SnapshotIntegrity): string {
  switch (integrity.state) {
    case "not-frozen":
      return "Snapshot integrity: not frozen yet (Draft or Returned revisions change as they are edited).";
    case "intact":
      return `Snapshot integrity: verified (sha-256 ${integrity.storedHash}).`;
    case "mismatch":
      return `Snapshot integrity: hash mismatch — stored ${integrity.storedHash ?? "(none)"}, recomputed ${integrity.recomputedHash}.`;
  }
}
