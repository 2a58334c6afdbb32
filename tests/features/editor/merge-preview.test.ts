import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { previewJoint } from "@/features/analysis/core/preview";
import { countChecks } from "@/features/analysis/core/checks/check-record";
import { mergePreview } from "@/features/editor/model/merge-preview";
import { moveBolt } from "@/features/editor/model/move-bolt";
import { firstDifference } from "@/features/editor/model/results-agree";
import { makeCircle, makeCover } from "./fixtures";

// The drag-time readout: the last full result with the light preview laid over it. The parts the
// preview computes must equal a fresh full analysis of the dragged layout exactly.
describe("mergePreview (drag-time result)", () => {
  it("on a circular flange a bolt slid along the bolt circle gives the full result's profile, checks and counts", () => {
    const before = makeCircle(12);
    const after = moveBolt(before, "b2", { sMm: before.bolts[0].sMm + 30 });
    const merged = mergePreview(analyzeJoint(before), previewJoint(after));
    const full = analyzeJoint(after);
    expect(firstDifference(merged.gasketStress.profile, full.gasketStress.profile)).toBeNull();
    expect(firstDifference(merged.gasketStress.boltSOnPathMm, full.gasketStress.boltSOnPathMm)).toBeNull();
    expect(merged.gasketStress.minMpa).toBe(full.gasketStress.minMpa);
    // Sliding along a circle keeps every edge distance: all check records, in order, match.
    expect(firstDifference(merged.checks, full.checks)).toBeNull();
    expect(merged.summary).toEqual(full.summary);
    expect(merged.checks.find((c) => c.id === "spacing.min-pitch:b1-b2")?.status).toBe("fail");
  });

  it("keeps the base's other records and recounts from the merged list", () => {
    const before = makeCover();
    const base = analyzeJoint(before);
    const after = moveBolt(before, "b3", { sMm: before.bolts[1].sMm + 25 });
    const merged = mergePreview(base, previewJoint(after));
    const ids = (cs: { id: string }[]) => cs.map((c) => c.id);
    expect(ids(merged.checks)).toEqual(ids(analyzeJoint(after).checks));
    for (const c of merged.checks.filter(
      (x) => !x.id.startsWith("spacing.") && !x.id.startsWith("gasket."),
    )) {
      expect(c).toBe(base.checks.find((b) => b.id === c.id));
    }
    const { failCount, warnCount, passCount } = merged.summary;
    expect({ failCount, warnCount, passCount }).toEqual(countChecks(merged.checks));
    const pair = (cs: typeof merged.checks) => cs.find((c) => c.id === "spacing.min-pitch:b2-b3")?.status;
    expect([pair(base.checks), pair(merged.checks)]).toEqual(["pass", "fail"]);
    // Untouched parts are the base's own objects (no copy per frame).
    expect(merged.bolts).toBe(base.bolts);
    expect(merged.assemblyPlan).toBe(base.assemblyPlan);
  });
});
