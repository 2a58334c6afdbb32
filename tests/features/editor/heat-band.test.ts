import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { buildHeatQuads, MAX_HEAT_QUADS } from "@/features/editor/model/heat-band";
import { toReadoutView } from "@/features/editor/model/readout-view";
import { girthFlange96 } from "../analysis/core/fixtures";

describe("heat strip along the gasket path", () => {
  const design = girthFlange96();
  const view = toReadoutView(analyzeJoint(design));
  const { sMm, stressMpa } = view.profile;

  it("merges the core's samples into at most MAX_HEAT_QUADS strips that keep the lowest stress", () => {
    expect(sMm.length).toBeGreaterThan(MAX_HEAT_QUADS);
    const quads = buildHeatQuads(design, sMm, stressMpa, view.profile.minFactor);
    expect(quads.length).toBe(MAX_HEAT_QUADS);
    const low = Math.min(...stressMpa) * view.profile.minFactor;
    expect(Math.min(...quads.map((q) => q.stressMpa))).toBe(low);
    expect(Math.max(...quads.map((q) => q.stressMpa))).toBeLessThanOrEqual(
      Math.max(...stressMpa) * view.profile.minFactor,
    );
  });

  it("keeps one strip per sample when there are few, and lays them round the whole ring", () => {
    const quads = buildHeatQuads(design, sMm, stressMpa, 1, 100_000);
    expect(quads.length).toBe(sMm.length);
    expect(quads.map((q) => q.stressMpa)).toEqual(stressMpa);
    // Every corner lies on the gasket band (ring gasket of the 96-bolt girth flange).
    const g = design.gasket;
    if (g.kind !== "ring" || g.geometry.kind !== "annulus") throw new Error("fixture changed");
    for (const q of quads.slice(0, 50)) {
      const r = q.x.map((x, i) => Math.hypot(x, q.y[i]));
      for (const v of r) {
        expect(v).toBeGreaterThan(g.geometry.innerDiameterMm / 2 - 1e-6);
        expect(v).toBeLessThan(g.geometry.outerDiameterMm / 2 + 1e-6);
      }
    }
  });
});
