import { readFileSync } from "node:fs";
import { beforeAll, describe, expect, it } from "vitest";
import { buildJointModel } from "@/features/analysis/core/joint-model";
import type { JointDesign } from "@/features/analysis/core/design";
import { solveInterface } from "@/features/fe-check/interface-study";
import { solveStack } from "@/features/fe-check/stack-study";
import { FeInputError, mapBoltStack, runStackCheck } from "@/features/fe-check/joint-stack";
import { CcxCancelled } from "@/features/fe-check/ccx-runner";

const rel = (a: number, b: number) => Math.abs(a / b - 1);
const example = (name: string): JointDesign =>
  JSON.parse(readFileSync(`examples/${name}.json`, "utf8")) as JointDesign;

describe("bolt stack model (FE cross-check, model 1)", () => {
  it("two layers give the two-plate engine's answer (the same problem meshed by both writers; internal)", async () => {
    const plate = { thicknessMm: 12, modulusMpa: 207_000, poisson: 0.3 };
    const common = {
      holeDiameterMm: 13,
      bearingDiameterMm: 18,
      outerRadiusMm: 100,
      bearing: "flexible" as const,
      elementSizeMm: 1.5,
    };
    const two = solveInterface({ ...common, upper: plate, lower: plate }, 10_000);
    const stack = await solveStack(
      {
        ...common,
        layers: [
          { name: "a", ...plate },
          { name: "b", ...plate },
        ],
      },
      10_000,
    );
    expect(rel(stack.memberStiffnessNPerMm, two.memberStiffnessNPerMm)).toBeLessThan(1e-6);
    expect(rel(stack.interfaces[0].loadedRadiusMm, two.loadedRadiusMm)).toBeLessThan(1e-6);
    expect(rel(stack.interfaces[0].peakMpa, two.peakMpa)).toBeLessThan(1e-6);
  });

  const model = buildJointModel(example("pipe-flange-nps6-spiral-wound"));
  let res: Awaited<ReturnType<typeof runStackCheck>>;
  beforeAll(async () => {
    res = await runStackCheck(model, solveStack);
  });
  it("NPS 6 example: the bearing faces' reactions equal the bolt force within 0.1 %; the contact pressure integrates to it within 0.5 % (equilibrium)", () => {
    expect(Math.abs(res.fe.reactionRatio - 1)).toBeLessThan(1e-3);
    expect(Math.abs(res.fe.contactForceRatio - 1)).toBeLessThan(5e-3);
    expect(res.forceN).toBe(model.preload.minN);
  });
  it("NPS 6 example: p(r) is compressive, zero at the plate's outer cells, and the loaded zone lies beyond the bearing face (internal)", () => {
    expect(res.pressure.every((p) => p.feMpa >= 0)).toBe(true);
    expect(res.pressure.at(-1)?.feMpa).toBe(0);
    expect(res.fe.loadedRadiusMm).toBeGreaterThan(model.bearingDiameterMm / 2);
  });

  it("NPS 6 example: one run at a time and two side by side settle on the same contact set, in fewer runs than the plain loop's 7 (internal)", async () => {
    const one = await runStackCheck(model, solveStack, { hooks: { parallelRuns: 1 } });
    const two = await runStackCheck(model, solveStack, { hooks: { parallelRuns: 2 } });
    for (const r of [one, two]) {
      expect(r.fe).toEqual(res.fe);
      expect(r.pressure).toEqual(res.pressure);
    }
    expect(one.linearRuns).toBeLessThan(7);
    expect(two.linearRuns).toBeLessThan(7);
  }, 120_000);

  it("a full-face gasket is a layer of its own with two contact interfaces", () => {
    const m = mapBoltStack(buildJointModel(example("rectangular-cover-full-face")));
    expect(m.spec.layers.map((l) => l.name)).toEqual(["S355 plate", "gasket", "S355 frame"]);
    expect(m.spec.layers[1]).toMatchObject({ thicknessMm: 3, modulusMpa: 50, poisson: 0 });
    expect(m.gasketPlaneInterface).toBe(0);
  });
  it("a mesh over the cap and a tapped-hole stud are refused with a clear message, before any solver run", async () => {
    await expect(runStackCheck(model, solveStack, { elementCap: 100 })).rejects.toThrow(
      /over the cap of 100/,
    );
    const d = example("pipe-flange-nps6-spiral-wound");
    d.fastener.termination = {
      kind: "tapped-hole",
      engagementMm: 20,
      memberThicknessMm: 40,
      memberModulusMpa: 200_000,
    };
    expect(() => mapBoltStack({ ...model, design: d })).toThrow(FeInputError);
  });
});

describe("solver runs off the event loop, with a time limit and cancellation", () => {
  const spec = {
    holeDiameterMm: 13,
    bearingDiameterMm: 18,
    outerRadiusMm: 100,
    bearing: "flexible" as const,
    elementSizeMm: 1.5,
    layers: [
      { name: "a", thicknessMm: 12, modulusMpa: 207_000, poisson: 0.3 },
      { name: "b", thicknessMm: 12, modulusMpa: 207_000, poisson: 0.3 },
    ],
  };
  it("a run past its time limit ends with a clear message, not a hang", async () => {
    await expect(solveStack(spec, 10_000, { timeoutMs: 1 })).rejects.toThrow(/past its time limit/);
  });
  it("aborting kills the solver and ends the study as cancelled", async () => {
    const abort = new AbortController();
    setTimeout(() => abort.abort(), 5);
    await expect(solveStack(spec, 10_000, { signal: abort.signal })).rejects.toBeInstanceOf(CcxCancelled);
  });
  it("the event loop keeps turning while the solver runs", async () => {
    let ticks = 0;
    const timer = setInterval(() => ticks++, 5);
    await solveStack(spec, 10_000);
    clearInterval(timer);
    expect(ticks).toBeGreaterThan(0);
  });
});
