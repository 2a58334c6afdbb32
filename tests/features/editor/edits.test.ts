import { describe, expect, it } from "vitest";
import { getBoltPathLengthMm, getBoltPoints, getNeighbourSpacings } from "@/features/analysis/core/geometry";
import { placeBoltsEqually } from "@/features/editor/model/place-bolts-equally";
import { moveBolt, nudgeBolt, resolveMoveTarget } from "@/features/editor/model/move-bolt";
import { addBolt } from "@/features/editor/model/add-bolt";
import { deleteBolts } from "@/features/editor/model/delete-bolt";
import { renumberBolts } from "@/features/editor/model/renumber-bolts";
import { rotatePattern } from "@/features/editor/model/rotate-pattern";
import { setField } from "@/features/editor/model/set-field";
import { getBoltCoordinates, setBoltCoordinates } from "@/features/editor/model/set-bolt-coordinates";
import { makeCircle, makeCover } from "./fixtures";

describe("place bolts equally", () => {
  it("places 16 bolts at equal pitch straddling the centre lines by default", () => {
    const d = placeBoltsEqually(makeCover(), 16);
    expect(d.bolts).toHaveLength(16);
    const L = getBoltPathLengthMm(d);
    const pitches = getNeighbourSpacings(d).map((s) => s.pitchMm);
    for (const p of pitches) expect(p).toBeCloseTo(L / 16, 9);
    // Straddling: no bolt sits on the top centre line (x = 0, s = 0); the first is half a pitch clockwise.
    expect(d.bolts[0].sMm).toBeCloseTo(L / 32, 9);
    expect(d.bolts.map((b) => b.id)).toEqual(Array.from({ length: 16 }, (_, i) => `b${i + 1}`));
  });

  it("puts a bolt on the centre line with phase 0", () => {
    const d = placeBoltsEqually(makeCircle(), 4, { phase: 0 });
    const p = getBoltPoints(d)[0];
    expect(p.x).toBeCloseTo(0, 9);
    expect(p.y).toBeCloseTo(170, 9);
  });

  it("refuses a count of 0, a fraction or more than the maximum", () => {
    const d = makeCover();
    expect(placeBoltsEqually(d, 0)).toBe(d);
    expect(placeBoltsEqually(d, 2.5)).toBe(d);
    expect(placeBoltsEqually(d, 10_000)).toBe(d);
  });
});

describe("move a bolt", () => {
  it("snaps along the path to the equal-pitch slot within the snap distance", () => {
    const d = placeBoltsEqually(makeCircle(8), 8);
    const L = getBoltPathLengthMm(d);
    const r = 170;
    // Slot 1 (b2) is at 1.5 pitches = 67.5°; drop b2 at 69° on a point 3 mm outside the path.
    const a = (69 * Math.PI) / 180;
    const t = resolveMoveTarget(
      d,
      "b2",
      { x: (r + 3) * Math.sin(a), y: (r + 3) * Math.cos(a) },
      { snapMm: 10 },
    );
    expect(t.snapped).toBe(true);
    expect(t.sMm).toBeCloseTo(1.5 * (L / 8), 9);
    expect(t.offPathMm).toBe(0);
  });

  it("stays where dropped outside the snap distance, and off the path when free", () => {
    const d = placeBoltsEqually(makeCircle(8), 8);
    const a = (80 * Math.PI) / 180;
    const onPath = resolveMoveTarget(d, "b2", { x: 175 * Math.sin(a), y: 175 * Math.cos(a) }, { snapMm: 2 });
    expect(onPath.snapped).toBe(false);
    expect(onPath.sMm).toBeCloseTo((80 / 360) * Math.PI * 340, 6);
    expect(onPath.offPathMm).toBe(0);
    const free = resolveMoveTarget(
      d,
      "b2",
      { x: 175 * Math.sin(a), y: 175 * Math.cos(a) },
      { free: true, snapMm: 50 },
    );
    expect(free.offPathMm).toBeCloseTo(5, 9);
  });

  it("snaps to the midpoint between the two neighbours", () => {
    const d = moveBolt(placeBoltsEqually(makeCircle(8), 8), "b1", { sMm: 10 });
    const L = getBoltPathLengthMm(d);
    const s3 = d.bolts[2].sMm;
    const mid = (10 + s3) / 2;
    const q = { x: 170 * Math.sin((mid + 1) / 170), y: 170 * Math.cos((mid + 1) / 170) };
    const t = resolveMoveTarget(d, "b2", q, { snapMm: 3 });
    expect(t.snapped).toBe(true);
    expect(t.sMm).toBeCloseTo(mid, 6);
    expect(t.sMm).toBeLessThan(L);
  });

  it("moves and wraps s, keeps the others, and returns the same object for a no-op", () => {
    const d = makeCover();
    const L = getBoltPathLengthMm(d);
    const moved = moveBolt(d, "b3", { sMm: L + 5 });
    expect(moved.bolts[2].sMm).toBeCloseTo(5, 9);
    expect(moved.bolts[0]).toBe(d.bolts[0]);
    expect(moveBolt(d, "b3", { sMm: d.bolts[2].sMm })).toBe(d);
    expect(moveBolt(d, "nope", { sMm: 1 })).toBe(d);
    expect(moveBolt(d, "b3", { sMm: Number.NaN })).toBe(d);
  });

  it("nudges along the path", () => {
    const d = makeCover();
    expect(nudgeBolt(d, "b1", 2.5).bolts[0].sMm).toBeCloseTo(d.bolts[0].sMm + 2.5, 9);
  });
});

describe("add, delete, renumber, rotate", () => {
  it("adds a bolt with the next free id", () => {
    const { design, boltId } = addBolt(makeCover(), 33);
    expect(boltId).toBe("b13");
    expect(design.bolts.at(-1)).toEqual({ id: "b13", sMm: 33 });
  });

  it("deletes bolts but never the last one", () => {
    const d = makeCover();
    expect(deleteBolts(d, ["b1", "b2"]).bolts).toHaveLength(10);
    const one = { ...d, bolts: [d.bolts[0]] };
    expect(deleteBolts(one, ["b1"])).toBe(one);
  });

  it("renumbers clockwise from the top and reports the id map", () => {
    const d = makeCover();
    const shuffled = { ...d, bolts: [d.bolts[5], d.bolts[0], { id: "b99", sMm: 1 }] };
    const { design, idMap } = renumberBolts(shuffled);
    expect(design.bolts.map((b) => b.id)).toEqual(["b1", "b2", "b3"]);
    expect(design.bolts[0].sMm).toBe(1);
    expect(idMap).toEqual({ b99: "b1", b1: "b2", b6: "b3" });
  });

  it("rotates the whole pattern and keeps every pitch", () => {
    const d = placeBoltsEqually(makeCover(), 16);
    const r = rotatePattern(d, 17);
    const before = getNeighbourSpacings(d)
      .map((s) => s.pitchMm)
      .sort();
    const after = getNeighbourSpacings(r)
      .map((s) => s.pitchMm)
      .sort();
    after.forEach((p, i) => expect(p).toBeCloseTo(before[i], 9));
    expect(r.bolts[0].sMm).toBeCloseTo(d.bolts[0].sMm + 17, 9);
  });
});

describe("set a field", () => {
  it("copies only along the path", () => {
    const d = makeCover();
    const e = setField(d, "loads.designPressureMpa", 2.5);
    expect(e.loads.designPressureMpa).toBe(2.5);
    expect(e.fastener).toBe(d.fastener);
    expect(d.loads.designPressureMpa).toBe(1);
    const l = setField(d, "layers.0.thicknessMm", 40);
    expect(l.layers[0]).toMatchObject({ thicknessMm: 40 });
    expect(l.layers[2]).toBe(d.layers[2]);
  });

  it("ignores unknown paths and prototype keys", () => {
    const d = makeCover();
    expect(setField(d, "loads.nothing.deep", 1)).toBe(d);
    expect(setField(d, "__proto__.x", 1)).toBe(d);
    expect(setField(d, "layers.9.thicknessMm", 1)).toBe(d);
    expect(setField(d, "loads.designPressureMpa", 1)).toBe(d);
  });
});

describe("bolt coordinates", () => {
  it("reads and writes x/y, angle and arc position", () => {
    const d = placeBoltsEqually(makeCircle(4), 4);
    const c = getBoltCoordinates(d, "b1")!;
    expect(c.angleDeg).toBeCloseTo(45, 9);
    const byAngle = setBoltCoordinates(d, "b1", { kind: "angle", angleDeg: 30 });
    expect(getBoltCoordinates(byAngle, "b1")!.angleDeg).toBeCloseTo(30, 6);
    const byXY = setBoltCoordinates(d, "b1", { kind: "xy", xMm: 0, yMm: 180 });
    const cx = getBoltCoordinates(byXY, "b1")!;
    expect(cx.xMm).toBeCloseTo(0, 6);
    expect(cx.yMm).toBeCloseTo(180, 6);
    expect(cx.offPathMm).toBeCloseTo(10, 6);
    const byArc = setBoltCoordinates(d, "b1", { kind: "arc", sMm: 100 });
    expect(byArc.bolts[0].sMm).toBe(100);
  });

  it("finds the angle on a rectangular path", () => {
    const d = makeCover();
    const e = setBoltCoordinates(d, "b1", { kind: "angle", angleDeg: 90 });
    const c = getBoltCoordinates(e, "b1")!;
    expect(c.yMm).toBeCloseTo(0, 4);
    expect(c.xMm).toBeCloseTo(260, 4);
  });
});
