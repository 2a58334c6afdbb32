import Drawing from "dxf-writer";
import { describe, expect, it } from "vitest";
import { getBoltPoints } from "@/features/analysis/core/geometry";
import { validateJointDesign } from "@/features/analysis/core/validate";
import { buildImportedDesign } from "@/features/imports/model/build-imported-design";
import { fitCircle } from "@/features/imports/model/fit-bolt-path";
import { parseDxfFlange } from "@/features/imports/model/parse-dxf-flange";
import { sniffContent } from "@/features/attachments/model/sniff-content";

// Drawings are generated here with dxf-writer (an independent DXF writer), so the parser is
// checked against a file it did not produce. Hole centres are placed off-origin on purpose to
// exercise the move to the outline's centre.
const TOL_MM = 1e-3;

function circularFlange(opts: {
  cx: number;
  cy: number;
  od: number;
  bc: number;
  n: number;
  hole: number;
  bore?: number;
  units?: "Millimeters" | "Inches";
}) {
  const d = new Drawing();
  d.setUnits(opts.units ?? "Millimeters");
  d.drawCircle(opts.cx, opts.cy, opts.od / 2);
  if (opts.bore) d.drawCircle(opts.cx, opts.cy, opts.bore / 2);
  const holes: { x: number; y: number }[] = [];
  for (let i = 0; i < opts.n; i++) {
    const a = ((i + 0.5) * 2 * Math.PI) / opts.n;
    const x = (opts.bc / 2) * Math.sin(a);
    const y = (opts.bc / 2) * Math.cos(a);
    holes.push({ x, y });
    d.drawCircle(opts.cx + x, opts.cy + y, opts.hole / 2);
  }
  return { text: d.toDxfString(), holes };
}

function expectSameHoles(actual: { xMm: number; yMm: number }[], expected: { x: number; y: number }[]) {
  expect(actual).toHaveLength(expected.length);
  for (const e of expected) {
    const nearest = Math.min(...actual.map((a) => Math.hypot(a.xMm - e.x, a.yMm - e.y)));
    expect(nearest).toBeLessThan(TOL_MM);
  }
}

describe("DXF flange import (drawings written by dxf-writer)", () => {
  it("recovers every bolt hole of a circular flange within 0.001 mm, the outline, and the bore", () => {
    const { text, holes } = circularFlange({
      cx: 150,
      cy: -40,
      od: 280,
      bc: 241.3,
      n: 8,
      hole: 22.2,
      bore: 168.3,
    });
    expect(sniffContent(new TextEncoder().encode(text))).toBe("dxf");
    const r = parseDxfFlange(text);
    if (!r.ok) throw new Error(r.message);
    expect(r.value.outline).toEqual({ kind: "circle", diameterMm: expect.closeTo(280, 6) });
    expect(r.value.bore?.diameterMm).toBeCloseTo(168.3, 6);
    expectSameHoles(r.value.boltHoles, holes);
    for (const h of r.value.boltHoles) expect(h.diameterMm).toBeCloseTo(22.2, 6);
  });

  it("reads $INSUNITS inches and converts to mm", () => {
    const { text, holes } = circularFlange({
      cx: 0,
      cy: 0,
      od: 11,
      bc: 9.5,
      n: 8,
      hole: 0.875,
      units: "Inches",
    });
    const r = parseDxfFlange(text);
    if (!r.ok) throw new Error(r.message);
    expect(r.value.unitsLabel).toBe("inches");
    expectSameHoles(
      r.value.boltHoles,
      holes.map((h) => ({ x: h.x * 25.4, y: h.y * 25.4 })),
    );
    expect(r.value.boltHoles[0].diameterMm).toBeCloseTo(22.225, 6);
  });

  it("takes the largest closed polyline as the outline and the most common diameter as bolt holes", () => {
    const d = new Drawing();
    d.setUnits("Millimeters");
    d.drawPolyline(
      [
        [10, 10],
        [710, 10],
        [710, 510],
        [10, 510],
      ],
      true,
    ); // 700 × 500 cover, bolts 50 mm from every edge
    const expected: { x: number; y: number }[] = [];
    for (const [x, y] of [
      [50, 50],
      [350, 50],
      [650, 50],
      [650, 450],
      [350, 450],
      [50, 450],
      [50, 250],
      [650, 250],
    ]) {
      d.drawCircle(x + 10, y + 10, 9);
      expected.push({ x: x + 10 - 360, y: y + 10 - 260 });
    }
    d.drawCircle(200, 200, 4); // a single tapped hole that must not count as a bolt hole
    const r = parseDxfFlange(d.toDxfString());
    if (!r.ok) throw new Error(r.message);
    expect(r.value.outline.kind).toBe("polygon");
    expectSameHoles(r.value.boltHoles, expected);
    expect(r.value.ignoredCircles).toBe(1);
    expect(r.value.warnings.join(" ")).toMatch(/1 other circle/);

    // The built design keeps every hole exactly where it was drawn (offset path + offPathMm).
    const built = buildImportedDesign({ name: "Imported cover", units: "SI" }, r.value);
    expect(built.fit.rule).toBe("outline-offset");
    expect(built.design.boltPath).toEqual({ kind: "offset", offsetMm: expect.closeTo(50, 6) });
    const points = getBoltPoints(built.design).map((p) => ({ xMm: p.x, yMm: p.y }));
    expectSameHoles(points, expected);
    expect(validateJointDesign(built.design)).toEqual([]);
  });

  it("fits a bolt circle through the centres of a circular pattern and keeps every hole", () => {
    const { text, holes } = circularFlange({
      cx: 3,
      cy: 4,
      od: 279.4,
      bc: 241.3,
      n: 8,
      hole: 22.225,
      bore: 168.3,
    });
    const r = parseDxfFlange(text);
    if (!r.ok) throw new Error(r.message);
    const built = buildImportedDesign({ name: "E-2107 inlet", units: "SI" }, r.value);
    expect(built.fit.rule).toBe("circle-fit");
    expect(built.design.boltPath).toEqual({ kind: "circle", diameterMm: expect.closeTo(241.3, 6) });
    expect(built.design.fastener.designation).toBe("M20");
    expectSameHoles(
      getBoltPoints(built.design).map((p) => ({ xMm: p.x, yMm: p.y })),
      holes,
    );
    expect(validateJointDesign(built.design)).toEqual([]);
  });

  it("refuses a drawing without a closed outline or without a repeated hole, with a clear message", () => {
    const d = new Drawing();
    d.drawLine(0, 0, 100, 0);
    const none = parseDxfFlange(d.toDxfString());
    expect(none).toMatchObject({ ok: false, message: expect.stringMatching(/no closed outline/) });
    const lonely = new Drawing();
    lonely.drawCircle(0, 0, 100);
    lonely.drawCircle(50, 0, 5);
    expect(parseDxfFlange(lonely.toDxfString())).toMatchObject({
      ok: false,
      message: expect.stringMatching(/No bolt holes/),
    });
    expect(parseDxfFlange("not a drawing at all").ok).toBe(false);
  });

  it("circle fit: decision pinned on an exact square", () => {
    const fit = fitCircle([
      { x: 1, y: 1 },
      { x: -1, y: 1 },
      { x: -1, y: -1 },
      { x: 1, y: -1 },
    ]);
    expect(fit?.r).toBeCloseTo(Math.SQRT2, 12);
    expect(Math.hypot(fit!.cx, fit!.cy)).toBeLessThan(1e-12);
  });
});
