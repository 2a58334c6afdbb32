import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { canonicalJson, computeContentHash, verifySnapshot } from "@/features/analysis/content-hash";
import { hashDocument } from "@/features/designs/mutations";

// Hashes of stored snapshots must never change: an approved revision's content hash is checked on
// every read ("Snapshot integrity"). The fixture is the obround manway example with its core
// 1.1.0 result (arrays cut to six entries), and both expected hashes were computed by the
// hand-written canonical JSON this project used before it moved to an RFC 8785 implementation.
// [internal] regression oracle: our own earlier output, not a published value.
const fixture = JSON.parse(
  readFileSync(path.join(import.meta.dirname, "fixtures/approved-snapshot.json"), "utf8"),
) as { coreVersion: string; document: unknown; result: unknown };

describe("canonical JSON hashing keeps the hashes already stored", () => {
  it("hashes the approved snapshot fixture as before", () => {
    const hash = computeContentHash(fixture);
    expect(hash).toBe("72a1ab7f4ed77bc62f63f22dba9b8c2b5db709e093b6a83f963ce1480b166900");
    expect(verifySnapshot({ ...fixture, contentHash: hash }).state).toBe("intact");
  });

  it("hashes a working revision's document as before", () => {
    expect(hashDocument(fixture.document as Parameters<typeof hashDocument>[0])).toBe(
      "068c5e5c46d3c74a01eae9b9165a61f44b92d26a4357dd340abbaa0bb40bfb50",
    );
  });

  it("writes RFC 8785 text: keys in UTF-16 order, ECMAScript numbers, no whitespace", () => {
    // RFC 8785 section 3.2.3 sorts by UTF-16 code units: "\u20ac" (U+20AC) before "\ud83d\ude00" (U+1F600).
    expect(canonicalJson({ "\ud83d\ude00": 1, "\u20ac": 2, a: 1e21, b: 0.000001, c: -0 })).toBe(
      '{"a":1e+21,"b":0.000001,"c":0,"\u20ac":2,"\ud83d\ude00":1}',
    );
  });
});
