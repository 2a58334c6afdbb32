import { describe, expect, it } from "vitest";
import { decimateMinMax } from "@/features/editor/model/decimate";

describe("decimateMinMax (seat trace drawing)", () => {
  const n = 6144;
  const xs = Array.from({ length: n }, (_, i) => (i * 4398) / n);
  // A bolt-pitch ripple with one sharp trough, like an unseated span between two bolts.
  const ys = xs.map((x, i) => 20 + 8 * Math.cos((x / 4398) * 96 * 2 * Math.PI) - (i === 3001 ? 19.5 : 0));

  it("keeps at most two points per column, in order, and the exact global extremes", () => {
    const d = decimateMinMax(xs, ys, 0, 4398, 460);
    expect(d.xs.length).toBeLessThanOrEqual(920);
    expect(d.xs.length).toBeGreaterThan(460);
    for (let i = 1; i < d.xs.length; i++) expect(d.xs[i]).toBeGreaterThan(d.xs[i - 1]);
    expect(Math.min(...d.ys)).toBe(Math.min(...ys));
    expect(Math.max(...d.ys)).toBe(Math.max(...ys));
    expect(d.ys).toContain(ys[3001]);
  });

  it("leaves a short series as it is", () => {
    expect(decimateMinMax([0, 1, 2], [5, 6, 7], 0, 2, 460)).toEqual({ xs: [0, 1, 2], ys: [5, 6, 7] });
  });
});
