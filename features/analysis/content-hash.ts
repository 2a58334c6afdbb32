import { createHash } from "node:crypto";
import canonicalize from "canonicalize";

// The frozen snapshot's fingerprint, over canonical JSON (RFC 8785, JSON Canonicalization Scheme:
// object keys sorted by UTF-16 code units, ECMAScript number text, no whitespace). Because
// PostgreSQL's jsonb reorders keys and drops duplicate ones, hashing the canonical form is what
// makes a value hash the same before it is written and after it is read back. The value first
// goes through JSON.stringify/parse, as it does on its way into jsonb: `undefined` members drop
// out and non-finite numbers become null. The reviews, the sheet and the designs' document hash
// use it.

/** Canonical JSON text of a JSON-compatible value. Example: canonicalJson({b: 1, a: [2, {d: 0, c: null}]}) === '{"a":[2,{"c":null,"d":0}],"b":1}' */
export function canonicalJson(value: unknown): string {
  const text = JSON.stringify(value);
  return text === undefined ? "null" : (canonicalize(JSON.parse(text)) ?? "null");
}

/** sha-256 (lower-case hex) of a value's canonical JSON. */
export function sha256OfJson(value: unknown): string {
  return createHash("sha256").update(canonicalJson(value), "utf8").digest("hex");
}

export interface SnapshotParts {
  document: unknown;
  result: unknown;
  coreVersion: string;
}

/** sha-256 (lower-case hex) of canonicalJson({ document, result, coreVersion }). */
export function computeContentHash(snapshot: SnapshotParts): string {
  return sha256OfJson({
    document: snapshot.document,
    result: snapshot.result,
    coreVersion: snapshot.coreVersion,
  });
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
