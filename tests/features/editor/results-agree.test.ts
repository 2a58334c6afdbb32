import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { firstDifference } from "@/features/editor/model/results-agree";
import { toReadoutView } from "@/features/editor/model/readout-view";
import { placeBoltsEqually } from "@/features/editor/model/place-bolts-equally";
import { moveBolt } from "@/features/editor/model/move-bolt";
import { makeCover } from "./fixtures";

/** Reorders every object's keys the way jsonb does (by length, then bytewise). */
function jsonbLike(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(jsonbLike);
  if (v && typeof v === "object") {
    const keys = Object.keys(v).sort((a, b) => a.length - b.length || (a < b ? -1 : a > b ? 1 : 0));
    return Object.fromEntries(keys.map((k) => [k, jsonbLike((v as Record<string, unknown>)[k])]));
  }
  return v;
}

describe("browser preview and stored result agree", () => {
  const design = placeBoltsEqually(makeCover(), 16);

  it("a result that went through JSON and jsonb key order equals a fresh analysis exactly", () => {
    const stored = JSON.parse(JSON.stringify(jsonbLike(JSON.parse(JSON.stringify(analyzeJoint(design))))));
    expect(firstDifference(JSON.parse(JSON.stringify(analyzeJoint(design))), stored)).toBeNull();
  });

  it("names the first differing path when one number differs", () => {
    const a = JSON.parse(JSON.stringify(analyzeJoint(design)));
    const b = structuredClone(a);
    b.gasketStress.minMpa += 1e-12;
    expect(firstDifference(a, b)).toBe("$.gasketStress.minMpa");
  });

  it("a moved bolt changes the result and the readout marks the pair it brought too close", () => {
    const close = moveBolt(design, "b2", { sMm: design.bolts[0].sMm + 30 });
    const view = toReadoutView(analyzeJoint(close));
    const c = view.checks.find((x) => x.id === "spacing.min-pitch:b1-b2");
    expect(c?.status).toBe("fail");
    expect(c?.boltIds).toEqual(["b1", "b2"]);
    expect(view.profile.sMm.length).toBeGreaterThan(100);
    expect(view.profile.minFactor).toBeLessThan(1);
  });
});
