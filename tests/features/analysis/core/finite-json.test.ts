import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { toFiniteJson, toFiniteRecords } from "@/features/analysis/core/finite-json";
import { girthFlange96 } from "./fixtures";

describe("finite JSON conversion", () => {
  it("turns non-finite numbers into null and counts them, in nested data and typed arrays", () => {
    const r = toFiniteJson({
      a: NaN,
      b: [1, Infinity],
      c: new Float64Array([2, -Infinity]),
      d: undefined,
      e: { f: "x" },
    });
    expect(r).toEqual({ value: { a: null, b: [1, null], c: [2, null], e: { f: "x" } }, replaced: 3 });
    expect("d" in r.value).toBe(false);
  });

  it("the short form for flat records gives exactly what the general walk gives", () => {
    const records = [
      { id: "x", value: NaN, limit: 3, subject: ["b1", "b2"], note: undefined, flags: [true, Infinity] },
      { id: "y", value: 1, limit: null, nested: { deep: [NaN] } },
    ];
    expect(toFiniteRecords(records)).toStrictEqual(toFiniteJson(records));
    const checks = analyzeJoint(girthFlange96()).checks;
    expect(toFiniteRecords(checks)).toStrictEqual(toFiniteJson(checks));
  });
});
