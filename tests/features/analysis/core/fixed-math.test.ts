import { describe, expect, it } from "vitest";
import * as fm from "@/features/analysis/core/fixed-math";
import { MM_PER_IN, MPA_PER_PSI, N_PER_LBF, NMM_PER_FTLB } from "@/features/analysis/core/units";

// The core's own elementary functions (fixed-math.ts). Their point is to give identical bits in
// every engine (the end-to-end result-agreement spec checks Chromium against the server); here they
// are held to the engine's built-ins within a few units in the last place, and to exact identities.
const ULP = 2.220446049250313e-16;
function maxUlps(f: (x: number) => number, ref: (x: number) => number, xs: number[]): number {
  let worst = 0;
  for (const x of xs) {
    const r = ref(x);
    if (r !== 0) worst = Math.max(worst, Math.abs(f(x) - r) / (Math.abs(r) * ULP));
  }
  return worst;
}
const grid = (a: number, b: number, n = 4001) =>
  Array.from({ length: n }, (_, i) => a + ((b - a) * i) / (n - 1));

describe("unit factors written as literals", () => {
  it("equal their definitions (1 lbf = 4.4482216152605 N, 1 in = 25.4 mm, NIST SP 811 appendix B) evaluated left to right", () => {
    expect(MPA_PER_PSI).toBe(N_PER_LBF / (MM_PER_IN * MM_PER_IN));
    expect(NMM_PER_FTLB).toBe(12 * MM_PER_IN * N_PER_LBF);
  });
});

describe("fixed-math (engine-independent elementary functions)", () => {
  it("agrees with the built-ins within a few ulps over the ranges the core uses", () => {
    expect(maxUlps(fm.sin, Math.sin, grid(-50, 50))).toBeLessThan(4);
    expect(maxUlps(fm.cos, Math.cos, grid(-50, 50))).toBeLessThan(4);
    expect(maxUlps(fm.tan, Math.tan, grid(-1.5, 1.5))).toBeLessThan(6);
    expect(maxUlps(fm.atan, Math.atan, grid(-100, 100))).toBeLessThan(4);
    expect(
      maxUlps(
        (x) => fm.atan2(x, 0.7),
        (x) => Math.atan2(x, 0.7),
        grid(-10, 10),
      ),
    ).toBeLessThan(4);
    expect(
      maxUlps(
        (x) => fm.atan2(x, -0.7),
        (x) => Math.atan2(x, -0.7),
        grid(-10, 10),
      ),
    ).toBeLessThan(4);
    expect(maxUlps(fm.exp, Math.exp, grid(-40, 40))).toBeLessThan(4);
    expect(maxUlps(fm.log, Math.log, grid(1e-6, 1e6))).toBeLessThan(4);
    expect(
      maxUlps(
        (x) => fm.pow(x, 0.25),
        (x) => Math.pow(x, 0.25),
        grid(1e-9, 1e9),
      ),
    ).toBeLessThan(4);
    expect(
      maxUlps(
        (x) => fm.pow(x, 1.7),
        (x) => Math.pow(x, 1.7),
        grid(0.01, 1e3),
      ),
    ).toBeLessThan(64);
  });

  it("keeps exact identities: sin 0 = 0, cos 0 = 1, exp 0 = 1, log 1 = 0, atan 1 = π/4, whole powers by multiplication", () => {
    expect(fm.sin(0)).toBe(0);
    expect(fm.cos(0)).toBe(1);
    expect(fm.exp(0)).toBe(1);
    expect(fm.log(1)).toBe(0);
    expect(fm.atan(1)).toBeCloseTo(Math.PI / 4, 15);
    expect(fm.sin(Math.PI / 6)).toBeCloseTo(0.5, 15); // sin 30° = 1/2
    expect(fm.exp(1)).toBeCloseTo(Math.E, 15); // ECMA-262 Math.E
    expect(fm.pow(3, 3)).toBe(27);
    expect(fm.pow(1.1, 3)).toBe(1.1 * 1.1 * 1.1);
    expect(fm.pow(2, -2)).toBe(0.25);
    expect(fm.atan2(0, -1)).toBeCloseTo(Math.PI, 15);
    expect(fm.log10(1000)).toBeCloseTo(3, 14);
    expect(Number.isNaN(fm.log(-1))).toBe(true);
  });
});
