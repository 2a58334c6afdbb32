// Our chart scales against the library the charts used before (d3-scale 4, still installed as the
// reference): the same positions, ticks and heat colours, to the last bit, on the domains the
// Seat trace, the FE comparison chart and the heat map meet.
import { scaleLinear } from "d3-scale";
import { describe, expect, it } from "vitest";
import { buildHeatScale } from "@/features/editor/model/heat-scale";
import { colourRamp, linearScale } from "@/features/ui/linear-scale";

// Deterministic spread of magnitudes: tiny (inches of a small flange), MPa and psi stresses.
function* domains(): Generator<[number, number]> {
  let seed = 7;
  const rnd = () => ((seed = (seed * 16807) % 2147483647) - 1) / 2147483646;
  for (const top of [1e-3, 0.37, 1, 2.5, 9.99, 10, 48.3, 100, 152.4, 333, 1000, 2450, 41_000, 87_654.3])
    yield [0, top];
  for (let i = 0; i < 300; i++) {
    const mag = Math.pow(10, -3 + 9 * rnd());
    const a = (rnd() - 0.3) * mag;
    yield [a, a + rnd() * mag * 3];
  }
  yield [5, 5];
  yield [12, 3];
  yield [0, -40];
}

describe("linearScale", () => {
  it("places values exactly where d3-scale's scaleLinear does", () => {
    for (const [d0, d1] of domains()) {
      const ours = linearScale([d0, d1], [38, 472]);
      const ref = scaleLinear().domain([d0, d1]).range([38, 472]);
      const flipped = linearScale([d0, d1], [180, 12]);
      const refFlipped = scaleLinear().domain([d0, d1]).range([180, 12]);
      for (const f of [-0.2, 0, 0.013, 0.25, 0.5, 0.731, 1, 1.4]) {
        const x = d0 + f * (d1 - d0);
        expect(ours(x)).toBe(ref(x));
        expect(flipped(x)).toBe(refFlipped(x));
      }
    }
  });

  it("gives d3-array's ticks for the counts the charts ask for and the default", () => {
    let nonEmpty = 0;
    for (const [d0, d1] of domains()) {
      const ref = scaleLinear().domain([d0, d1]);
      for (const n of [undefined, 1, 4, 6]) {
        const t = linearScale([d0, d1], [0, 1]).ticks(n);
        expect(t).toEqual(ref.ticks(n));
        if (t.length > 1) nonEmpty++;
      }
    }
    expect(nonEmpty).toBeGreaterThan(900);
  });

  it("ticks a 0 to 152.4 MPa axis at 0, 50, 100, 150 and a 0 to 0.37 in axis in steps of 0.1", () => {
    expect(linearScale([0, 152.4], [0, 1]).ticks(4)).toEqual([0, 50, 100, 150]);
    expect(linearScale([0, 0.37], [0, 1]).ticks(4)).toEqual([0, 0.1, 0.2, 0.3]);
  });
});

describe("colourRamp", () => {
  const STOPS = [
    { value: 0, colour: "#b3261e" },
    { value: 34.4, colour: "#e7bd6e" },
    { value: 34.4344, colour: "#8fbf8f" },
    { value: 210, colour: "#2f7d4f" },
    { value: 210.2, colour: "#1d2739" },
    { value: 260, colour: "#1d2739" },
  ];

  it("matches d3-scale's clamped piecewise colour scale at and between every stop and outside", () => {
    const ours = colourRamp(STOPS);
    const ref = scaleLinear<string>()
      .domain(STOPS.map((s) => s.value))
      .range(STOPS.map((s) => s.colour))
      .clamp(true);
    const xs = [-5, 300, ...STOPS.map((s) => s.value)];
    for (let i = 0; i <= 2600; i++) xs.push(i / 10);
    for (const x of xs) expect(ours(x)).toBe(ref(x));
    expect(ours(0)).toBe("rgb(179, 38, 30)");
  });

  it("gives the heat map's colours as d3-scale did, with and without a crush limit", () => {
    for (const [max, seat, crush] of [
      [120, 69, 280],
      [300, 69, 280],
      [40, null, null],
      [95.5, 44.8, null],
      [0, 0, null],
    ] as const) {
      const heat = buildHeatScale(max, seat, crush);
      const ref = scaleLinear<string>()
        .domain(heat.stops.map((s) => s.stressMpa))
        .range(heat.stops.map((s) => s.colour))
        .clamp(true);
      for (let i = 0; i <= 400; i++) {
        const v = (heat.maxMpa * i) / 300;
        expect(heat.colour(v)).toBe(ref(Math.max(0, v)));
      }
    }
  });

  it("refuses fewer than two stops and a colour that is not hex", () => {
    expect(() => colourRamp([{ value: 0, colour: "#000000" }])).toThrow(/two stops/);
    expect(() =>
      colourRamp([
        { value: 0, colour: "red" },
        { value: 1, colour: "#000" },
      ]),
    ).toThrow(/hex colour/);
  });
});
