import { describe, expect, it } from "vitest";
import { findBlock, parseDat, elementMeans, nodeVectors } from "@/features/fe-check/dat-parser";
import { runCcx, staShowsFinishedStep, CcxError } from "@/features/fe-check/ccx-runner";
import {
  boussinesqSurfaceDeflectionMm,
  buildHalfSpaceMesh,
  ellipticKE,
  writeHalfSpaceDeck,
} from "@/features/fe-check/half-space-check";
import { CCX_AXISYM_FORCE_FACTOR } from "@/features/fe-check/interface-result";
import { solveInterface } from "@/features/fe-check/interface-study";
import type { AxisymSpec } from "@/features/fe-check/axisym-model";

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe("CalculiX .dat and .sta reading (internal)", () => {
  const dat = `
 displacements (vx,vy,vz) for set NALL and time  0.1000000E+01

         1 -8.330856E-05  2.209880E-04  0.000000E+00
         2 -7.491413E-05  2.024795E-04  0.000000E+00

 total force (fx,fy,fz) for set NBOT and time  0.1000000E+01

       -1.0E-01  1.745329E+00  0.0E+00

 stresses (elem, integ.pnt.,sxx,syy,szz,sxy,sxz,syz) for set ELAYER and time  0.1000000E+01

      1569   1  5.0E-09 -1.0E+00  4.8E-09 0 0 0
      1569   2  5.0E-09 -3.0E+00  4.8E-09 0 0 0
`;
  const blocks = parseDat(dat);
  it("reads node, total and element blocks by quantity and set", () => {
    expect(blocks.map((b) => `${b.quantity}|${b.set}`)).toEqual([
      "displacements|NALL",
      "total force|NBOT",
      "stresses|ELAYER",
    ]);
    expect(nodeVectors(findBlock(blocks, "displacements", "NALL")).get(2)?.[1]).toBeCloseTo(2.024795e-4, 10);
    expect(findBlock(blocks, "total force", "NBOT").rows[0][1]).toBeCloseTo(1.745329, 6);
    expect(elementMeans(findBlock(blocks, "stresses", "ELAYER")).get(1569)?.[1]).toBeCloseTo(-2, 10);
  });
  it("names a missing block", () => expect(() => findBlock(blocks, "forces", "NTOP")).toThrow(/NTOP/));
  it("a finished step needs an increment that reaches step time 1 in .sta", () => {
    const head =
      "SUMMARY OF JOB INFORMATION\n  STEP      INC     ATT  ITRS     TOT TIME     STEP TIME      INC TIME\n";
    expect(
      staShowsFinishedStep(
        head + "     1          1     1     1  0.100000E+01  0.100000E+01  0.100000E+01\n",
      ),
    ).toBe(true);
    expect(
      staShowsFinishedStep(
        head + "     1          1     1     4  0.500000E+00  0.500000E+00  0.500000E+00\n",
      ),
    ).toBe(false);
    expect(staShowsFinishedStep(head)).toBe(false);
  });
  it("a deck CalculiX refuses raises its *ERROR message, not a parse of missing output", () => {
    expect(() => runCcx("*NODE\n1, 0, 0\n*STEP\n*STATIC\n*BOGUS KEYWORD\n*END STEP\n")).toThrow(CcxError);
  });
});

describe("complete elliptic integrals (Abramowitz & Stegun table 17.1)", () => {
  it("K(sin 30°) = 1.685750, E(sin 30°) = 1.467462", () => {
    const { K, E } = ellipticKE(0.5);
    expect(K).toBeCloseTo(1.68575, 5);
    expect(E).toBeCloseTo(1.467462, 5);
  });
});

describe("FE engine against Boussinesq: half-space under uniform pressure on a circle (Timoshenko & Goodier §138)", () => {
  const spec = { loadRadiusMm: 10, pressureMpa: 100, modulusMpa: 200_000, poisson: 0.3, elementSizeMm: 0.5 };
  const mesh = buildHalfSpaceMesh(spec);
  const blocks = parseDat(runCcx(writeHalfSpaceDeck(spec, mesh)));
  const u = nodeVectors(findBlock(blocks, "displacements", "NTOP"));
  const top = mesh.zs.length - 1;
  const w = (r: number) => {
    const i = mesh.rs.findIndex((x) => Math.abs(x - r) < 1e-9);
    return -(u.get(mesh.node(i, top))?.[1] ?? NaN);
  };
  it("the bottom reaction equals the applied p·π·a² within 0.1 % (forces per 2° segment × 180)", () => {
    const rf = findBlock(blocks, "total force", "NBOT").rows[0][1] * CCX_AXISYM_FORCE_FACTOR;
    expect(rel(rf, spec.pressureMpa * Math.PI * spec.loadRadiusMm ** 2)).toBeLessThan(1e-3);
  });
  for (const r of [5, 10, 20]) {
    it(`w(0) − w(${r / 10}·a) within 2 % of the closed form`, () => {
      const exact =
        boussinesqSurfaceDeflectionMm(0, 10, 100, 200_000, 0.3) -
        boussinesqSurfaceDeflectionMm(r, 10, 100, 200_000, 0.3);
      expect(rel(w(0) - w(r), exact)).toBeLessThan(0.02);
    });
  }
  it("closed form at the centre is 2(1 − ν²)·p·a/E and at the edge 4(1 − ν²)·p·a/(π·E) (Johnson, Contact Mechanics, eq. 3.39)", () => {
    expect(boussinesqSurfaceDeflectionMm(0, 10, 100, 200_000, 0.3)).toBeCloseTo(
      (2 * 0.91 * 100 * 10) / 200_000,
      12,
    );
    expect(boussinesqSurfaceDeflectionMm(10, 10, 100, 200_000, 0.3)).toBeCloseTo(
      (4 * 0.91 * 100 * 10) / (Math.PI * 200_000),
      12,
    );
  });
});

describe("FE engine: one M16 bolt clamping two 16 mm steel plates (hole 1.1 d, bearing 1.5 d)", () => {
  const d = 16;
  const spec = (bearing: AxisymSpec["bearing"], h: number): AxisymSpec => ({
    upper: { thicknessMm: 16, modulusMpa: 207_000, poisson: 0.3 },
    lower: { thicknessMm: 16, modulusMpa: 207_000, poisson: 0.3 },
    holeDiameterMm: 1.1 * d,
    bearingDiameterMm: 1.5 * d,
    outerRadiusMm: 8 * d + 64,
    bearing,
    elementSizeMm: h,
  });
  const coarse = solveInterface(spec("flexible", d / 12), 10_000);
  const fine = solveInterface(spec("flexible", d / 24), 10_000);
  it("the contact pressure integrates to the clamp force within 0.5 %; the support node carries < 0.1 % of it", () => {
    for (const s of [coarse, fine]) {
      expect(Math.abs(s.contactForceRatio - 1)).toBeLessThan(5e-3);
      expect(s.reactionRatio).toBeLessThan(1e-3);
    }
  });
  it("mesh convergence: loaded-zone radius, peak pressure and member stiffness change < 2 % from d/12 to d/24", () => {
    expect(rel(coarse.loadedRadiusMm, fine.loadedRadiusMm)).toBeLessThan(0.02);
    expect(rel(coarse.peakMpa, fine.peakMpa)).toBeLessThan(0.02);
    expect(rel(coarse.memberStiffnessNPerMm, fine.memberStiffnessNPerMm)).toBeLessThan(0.02);
  });
  it("the plates separate beyond a loaded zone, which lies beyond the bearing edge (internal)", () => {
    expect(fine.loadedRadiusMm).toBeGreaterThan(12);
    expect(fine.cells.at(-1)?.closed).toBe(false);
    expect(fine.cells.every((c) => c.pressureMpa >= 0)).toBe(true);
  });
  it("a rigid bearing: the two bearing faces' reactions balance within 0.1 % and it is stiffer than a flexible one", () => {
    const rigid = solveInterface(spec("rigid", d / 12), 10_000);
    expect(Math.abs(rigid.contactForceRatio - 1)).toBeLessThan(5e-3);
    expect(Math.abs(rigid.reactionRatio - 1)).toBeLessThan(1e-3);
    expect(rigid.memberStiffnessNPerMm).toBeGreaterThan(coarse.memberStiffnessNPerMm);
  });
});
