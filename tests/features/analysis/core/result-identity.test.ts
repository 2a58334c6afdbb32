import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { CORE_VERSION } from "@/features/analysis/core/version";
import { IDENTITY_CASES, IDENTITY_FIXTURE, identityOf, type IdentityRecord } from "./result-identity-cases";

// [internal] regression oracle: the hashes were captured from main (core 2.2.0, commit 67247a3) before the path
// estimate was made faster; a speed-up that changes any bit of any result fails.
const fixture = JSON.parse(readFileSync(IDENTITY_FIXTURE, "utf8")) as Record<string, IdentityRecord>;

describe("results stay the same bit for bit", () => {
  it("covers every case of the fixture", () => {
    expect(Object.keys(fixture).sort()).toEqual(IDENTITY_CASES.map(([n]) => n).sort());
    expect(CORE_VERSION).toMatch(/^\d+\.\d+\.\d+$/);
  });
  for (const [name, make] of IDENTITY_CASES) {
    it(name, () => {
      expect(identityOf(make)).toEqual(fixture[name]);
    });
  }
});
