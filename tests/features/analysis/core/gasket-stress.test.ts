import { describe, expect, it } from "vitest";
import { buildJointModel } from "@/features/analysis/core/joint-model";
import { computeGasketStressProfiles } from "@/features/analysis/core/gasket-stress";
import { computeGasketStressGrid } from "@/features/analysis/core/gasket-stress-grid";
import { hetenyiPeriodicDeflectionMm, solveBeamOnFoundation } from "@/features/analysis/core/beam-foundation";
import { coneFootprintIntegralMm2 } from "@/features/analysis/core/cone-superposition";
import type { JointDesign } from "@/features/analysis/core/design";
import { circularFlange, ELASTOMER_INSERTION, rectangularCover } from "./fixtures";

const profiles = (d: JointDesign) => computeGasketStressProfiles(buildJointModel(d));
const steelToSteel = {
  ...ELASTOMER_INSERTION,
  name: "metal to metal (stiff thin contact)",
  modulusMpa: 200_000,
  thicknessMm: 0.2,
  m: 0,
  yMpa: 0,
};

describe("beam on elastic foundation (Hetényi 1946, periodic superposition)", () => {
  // The oracle below is itself checked against the published closed form for one load on an
  // infinite beam: w(x) = (Pλ/2k)·e^(−λx)(cos λx + sin λx) (Hetényi, Beams on Elastic Foundation,
  // 1946, ch. II; Timoshenko, Strength of Materials II, §1). The numbers are the formula's, by hand
  // [calc]: w(0) = Pλ/2k; w(π/4λ) = √2·e^(−π/4) = 0.64479·w0; w(π/2λ) = e^(−π/2) = 0.20788·w0;
  // zero at 3π/4λ; the foundation pressure k·w/b under the load is Pλ/2b.
  it("one load on a long path: the oracle gives Hetényi's infinite-beam values (w0 = Pλ/2k, 0.64479, 0.20788, 0 at 3π/4λ)", () => {
    const k = 400, // N/mm² per mm of approach over the strip (k = Eg·b/tg)
      EI = 2e9,
      P = 30_000;
    const lambda = Math.pow(k / (4 * EI), 0.25);
    const L = 200 / lambda; // far longer than the decay length: the images are negligible
    const loads = [{ sMm: 0, forceN: P }];
    const w0 = (P * lambda) / (2 * k);
    const at = (x: number) => hetenyiPeriodicDeflectionMm(loads, L, k, lambda, x);
    expect(at(0) / w0).toBeCloseTo(1, 9);
    expect(at(Math.PI / (4 * lambda)) / w0).toBeCloseTo(0.64479, 5);
    expect(at(Math.PI / (2 * lambda)) / w0).toBeCloseTo(0.20788, 5);
    expect(at((3 * Math.PI) / (4 * lambda)) / w0).toBeCloseTo(0, 9);
    // Superposition: a second equal load 0.5/λ away adds w0·e^(−0.5)(cos 0.5 + sin 0.5) under the first.
    const two = [
      { sMm: L / 2, forceN: P },
      { sMm: L / 2 + 0.5 / lambda, forceN: P },
    ];
    const exact = hetenyiPeriodicDeflectionMm(two, L, k, lambda, L / 2);
    expect(exact / w0).toBeCloseTo(1 + Math.exp(-0.5) * (Math.cos(0.5) + Math.sin(0.5)), 6);
  });
  it("finite-difference solution reproduces the periodic Hetényi superposition within 0.2 %", () => {
    const L = 800,
      n = 8,
      k = 2000,
      EI = 1e10;
    const loads = Array.from({ length: n }, (_, i) => ({ sMm: (i + 0.5) * (L / n), forceN: 50_000 }));
    const lambda = Math.pow(k / (4 * EI), 0.25);
    const sol = solveBeamOnFoundation({
      pathLengthMm: L,
      nodes: n * 64,
      loads,
      flexuralRigidityNmm2: EI,
      foundationModulusMpa: k,
    });
    for (const j of [0, 16, 32, 48]) {
      const exact = hetenyiPeriodicDeflectionMm(loads, L, k, lambda, (j * L) / (n * 64));
      expect(Math.abs(sol.deflectionMm[j] - exact) / exact).toBeLessThan(0.002);
    }
  });
  it("force balance: Σ k·w·h = Σ F exactly, also with lift-off; never a negative stress", () => {
    const L = 3200,
      n = 8;
    const loads = Array.from({ length: n }, (_, i) => ({ sMm: (i + 0.5) * (L / n), forceN: 50_000 }));
    const sol = solveBeamOnFoundation({
      pathLengthMm: L,
      nodes: 512,
      loads,
      flexuralRigidityNmm2: 2e8,
      foundationModulusMpa: 2000,
    });
    expect(sol.liftedLengthMm).toBeGreaterThan(0);
    expect(sol.converged).toBe(true);
    let F = 0;
    for (const q of sol.lineLoadNPerMm) {
      expect(q).toBeGreaterThanOrEqual(0);
      F += (q * L) / 512;
    }
    expect(Math.abs(F - 400_000) / 400_000).toBeLessThan(1e-9);
  });
  it("the ratio min/max depends only on λ·pitch (scaling the path and the stiffnesses together)", () => {
    const ratio = (scale: number) => {
      const L = 800 * scale,
        n = 8;
      const loads = Array.from({ length: n }, (_, i) => ({ sMm: (i + 0.5) * (L / n), forceN: 1000 }));
      // λ ∝ (k/EI)^¼: scaling lengths by s and EI by s⁴ keeps λ·pitch fixed
      const sol = solveBeamOnFoundation({
        pathLengthMm: L,
        nodes: 512,
        loads,
        flexuralRigidityNmm2: 1e9 * scale ** 4,
        foundationModulusMpa: 2000,
      });
      return Math.min(...sol.lineLoadNPerMm) / Math.max(...sol.lineLoadNPerMm);
    };
    expect(ratio(2)).toBeCloseTo(ratio(1), 6);
  });
});

describe("force balance of both estimators (integrated gasket stress = Σ bolt forces within 0.5 %)", () => {
  it("beam, ring gasket, along the path", () => {
    const p = profiles(circularFlange());
    expect(Math.abs(p.beamInfo.forceBalanceRatio - 1)).toBeLessThan(0.005);
  });
  it("beam, ring gasket, over the 512 × 512 area grid", () => {
    const g = computeGasketStressGrid(circularFlange({ boltCount: 12 }), 512, 512, { estimator: "beam" });
    expect(Math.abs(g.integratedForceN / g.totalBoltForceN - 1)).toBeLessThan(0.005);
  });
  it("cone, full-face rectangular cover, over the 512 × 512 area grid (footprints clipped by holes and edges)", () => {
    const g = computeGasketStressGrid(rectangularCover(), 512, 512, { estimator: "cone" });
    expect(Math.abs(g.integratedForceN / g.totalBoltForceN - 1)).toBeLessThan(0.005);
  });
  it("cone, full-face circular flange with overlapping footprints", () => {
    const g = computeGasketStressGrid(
      circularFlange({ gasket: "full-face", boltCount: 16, gasketMaterial: steelToSteel }),
      512,
      512,
      { estimator: "cone" },
    );
    expect(Math.abs(g.integratedForceN / g.totalBoltForceN - 1)).toBeLessThan(0.005);
  });
  it("footprint integral of the linear falloff: π(rc − ri)(rc + 2ri)/3", () => {
    const ri = 9,
      rc = 24;
    let num = 0;
    const m = 20000;
    for (let i = 0; i < m; i++) {
      const r = ri + ((i + 0.5) * (rc - ri)) / m;
      num += ((rc - r) / (rc - ri)) * 2 * Math.PI * r * ((rc - ri) / m);
    }
    expect(coneFootprintIntegralMm2(ri, rc)).toBeCloseTo(num, 6);
  });
});

describe("symmetry: a regular pattern gives identical stress at every bolt", () => {
  for (const est of ["beam", "cone"] as const) {
    it(`${est} estimate, 12 bolts on a circle`, () => {
      const d = circularFlange({
        boltCount: 12,
        boltCircleMm: 300,
        outsideDiameterMm: 350,
        gasket: "full-face",
        gasketMaterial: est === "cone" ? steelToSteel : ELASTOMER_INSERTION,
      });
      const p = profiles(d);
      const values = est === "cone" ? p.coneMpa : p.beamMpa;
      const spp = d.estimator.samplesPerPitch;
      // samples half a hole beyond each bolt (on gasket material) and at mid-span
      for (const off of [spp / 2 + 6, 0]) {
        const ref = values[off];
        for (let i = 0; i < 12; i++) expect(values[(off + i * spp) % values.length]).toBeCloseTo(ref, 6);
      }
    });
  }
});

describe("monotonicity: more bolts, thicker or stiffer flange never lowers the minimum stress", () => {
  const minOf = (d: JointDesign) => {
    const p = profiles(d);
    return p.beam.minMpa;
  };
  it("more bolts (8 → 12 → 16)", () => {
    const m = [8, 12, 16].map((n) => minOf(circularFlange({ boltCount: n })));
    expect(m[1]).toBeGreaterThanOrEqual(m[0]);
    expect(m[2]).toBeGreaterThanOrEqual(m[1]);
  });
  it("thicker flange (10 → 20 → 40 mm), wide pitch so the minimum is mid-span", () => {
    const m = [10, 20, 40].map((t) => minOf(circularFlange({ boltCount: 4, flangeThicknessMm: t })));
    expect(m[1]).toBeGreaterThanOrEqual(m[0]);
    expect(m[2]).toBeGreaterThanOrEqual(m[1]);
  });
  it("stiffer flange (70 → 200 GPa)", () => {
    const soft = minOf(circularFlange({ boltCount: 4, flangeThicknessMm: 12, flangeModulusMpa: 70_000 }));
    const stiff = minOf(circularFlange({ boltCount: 4, flangeThicknessMm: 12, flangeModulusMpa: 200_000 }));
    expect(stiff).toBeGreaterThanOrEqual(soft);
  });
  it("cone: more bolts on a full-face cover never lowers the minimum between bolts", () => {
    const c = (n: number) =>
      profiles(rectangularCover({ boltCount: n, gasketMaterial: steelToSteel, estimator: "cone" })).cone
        .minMpa;
    expect(c(40)).toBeGreaterThanOrEqual(c(20));
    expect(c(80)).toBeGreaterThanOrEqual(c(40));
  });
});

describe("limits", () => {
  it("cone footprints that do not reach the neighbour leave zero stress between the bolts (a finding, not an error)", () => {
    const d = rectangularCover({
      boltCount: 12,
      gasketMaterial: steelToSteel,
      coneAngle: { mode: "fixed", degrees: 30 },
    });
    const model = buildJointModel(d);
    const p = computeGasketStressProfiles(model);
    const pitch = p.pathLengthMm / 12;
    expect(2 * model.coneRadiusMm).toBeLessThan(pitch);
    expect(p.cone.minMpa).toBe(0);
    expect(p.cone.unloadedLengthMm).toBeGreaterThan(0);
    expect(p.coneMpa[0]).toBe(0); // s = 0 is mid-span between the last and the first bolt
  });
  it("estimator choice: soft gasket under a thick flange → beam governs, even for a full-face gasket", () => {
    const p = profiles(rectangularCover({ coverThicknessMm: 40 }));
    expect(p.choice.estimator).toBe("beam");
    expect(p.choice.spreadRatio).toBeGreaterThanOrEqual(1);
  });
  it("estimator choice: stiff thin contact (metal to metal) under a thin plate → cone governs", () => {
    const p = profiles(rectangularCover({ gasketMaterial: steelToSteel, coverThicknessMm: 12 }));
    expect(p.choice.estimator).toBe("cone");
    expect(p.choice.spreadRatio).toBeLessThan(1);
  });
  it("a raised-face ring gasket that no cone reaches is carried by flange bending (beam)", () => {
    const p = profiles(circularFlange({ gasket: { innerDiameterMm: 160, outerDiameterMm: 180 } }));
    expect(p.coneMisses).toBe(true);
    expect(p.choice.estimator).toBe("beam");
  });
  it("wide pitch, soft gasket, thin flange: tensionless contact, stress never negative, lifted length reported", () => {
    const p = profiles(
      circularFlange({
        boltCount: 4,
        flangeThicknessMm: 6,
        gasketMaterial: { ...ELASTOMER_INSERTION, modulusMpa: 20_000 },
      }),
    );
    expect(p.beam.unloadedLengthMm).toBeGreaterThan(0);
    expect(Math.min(...p.beamMpa)).toBeGreaterThanOrEqual(0);
    expect(Math.abs(p.beamInfo.forceBalanceRatio - 1)).toBeLessThan(0.005);
  });
  it("the beam mean equals Σ F / gasket area for an annular gasket", () => {
    const d = circularFlange();
    const model = buildJointModel(d);
    const p = computeGasketStressProfiles(model);
    expect(p.beam.meanMpa).toBeCloseTo(p.totalForceN / model.region.areaMm2, 3);
  });
});
