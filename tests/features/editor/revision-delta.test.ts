import { describe, expect, it } from "vitest";
import type { JointDesign } from "@/features/analysis/core/design";
import { sampleCover } from "@/tests/fixtures/sample-cover";
import { describeInputChanges, summarisePattern } from "@/features/editor/model/revision-delta";
import { rotatePattern, degreesToArcMm } from "@/features/editor/model/rotate-pattern";

// Our own fictional E-2107 flange (340 mm OD, 12 × M20 on a 290 mm bolt circle); no published data.
const base = (): JointDesign => sampleCover("E-2107 compare");

describe("revision delta", () => {
  it("reads a turn of the whole pattern as one sentence, not one row per bolt", () => {
    const a = base();
    const b = rotatePattern(a, degreesToArcMm(a, 15));
    expect(summarisePattern(a, b)).toEqual(["pattern turned 15° clockwise"]);
    expect(summarisePattern(a, rotatePattern(a, degreesToArcMm(a, -7.5)))).toEqual([
      "pattern turned 7.5° anticlockwise",
    ]);
    expect(describeInputChanges(a, b)).toEqual([]);
  });

  it("counts added bolts and a larger bolt circle (same angles: no turn), and one moved bolt on its own", () => {
    const a = base();
    const b: JointDesign = {
      ...a,
      boltPath: { kind: "circle", diameterMm: 300 },
      bolts: [
        ...a.bolts.map((x) => ({ ...x, sMm: (x.sMm * 300) / 290 })),
        { id: "b13", sMm: 10 },
        { id: "b14", sMm: 20 },
      ],
    };
    expect(summarisePattern(a, b)).toEqual([
      "2 bolts added",
      "bolt count 12 → 14",
      "bolt circle 10 mm larger",
    ]);
    const one = { ...a, bolts: a.bolts.map((x) => (x.id === "b5" ? { ...x, sMm: x.sMm + 6 } : x)) };
    expect(summarisePattern(a, one)).toEqual(["1 bolt moved along the bolt path"]);
  });

  it("labels inputs as the form does, in display units, with catalogue names", () => {
    const a = base();
    const b: JointDesign = {
      ...a,
      loads: { ...a.loads, designPressureMpa: a.loads.designPressureMpa + 0.5 },
      fastener: { ...a.fastener, materialId: "astm-a193-b7" },
      layers: a.layers.map((l) => (l.role === "gasket" ? l : { ...l, thicknessMm: l.thicknessMm + 2 })),
    };
    const changes = describeInputChanges(a, b);
    const labels = changes.map((c) => c.label);
    expect(labels).toContain("Design pressure");
    expect(labels).toContain("Bolt material");
    expect(labels).toContain("Flange thickness, plate 1");
    expect(labels.every((l) => !/[.[\]]/.test(l))).toBe(true);
    const pressure = changes.find((c) => c.label === "Design pressure")!;
    expect(pressure.after).toMatch(/ MPa$/);
    expect(changes.find((c) => c.label === "Bolt material")!.before).not.toContain("iso-898");
    const us = describeInputChanges({ ...a, units: "US" }, { ...b, units: "US" });
    expect(us.find((c) => c.label === "Flange thickness, plate 1")!.after).toMatch(/ in$/);
  });
});
