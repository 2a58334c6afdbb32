import { readFileSync } from "node:fs";
import { join } from "node:path";
import { DxfWriter, Units, point3d } from "@tarikjabiri/dxf";
import { describe, expect, it } from "vitest";
import { getBoltPoints } from "@/features/analysis/core/geometry";
import { validateJointDesign } from "@/features/analysis/core/validate";
import { parseDxfFlange } from "@/features/imports/model/parse-dxf-flange";
import { prepareImport } from "@/features/imports/model/prepare-import";

// Drawings written by independent DXF libraries (@tarikjabiri/dxf, makerjs), not by Sealpitch's
// writer: see tests/fixtures/intake/generate-fixtures.ts. The expected geometry is the generator's
// own input, stored beside the files in manifest.json.
const DIR = join(process.cwd(), "tests/fixtures/intake");
const file = (name: string) => readFileSync(join(DIR, name), "utf8");
const manifest = JSON.parse(file("manifest.json"));
const TOL_MM = 1e-3;

function expectSameHoles(actual: { xMm: number; yMm: number }[], expected: { x: number; y: number }[]) {
  expect(actual).toHaveLength(expected.length);
  for (const e of expected) {
    const nearest = Math.min(...actual.map((a) => Math.hypot(a.xMm - e.x, a.yMm - e.y)));
    expect(nearest).toBeLessThan(TOL_MM);
  }
}

function read(name: string, options = {}) {
  const r = parseDxfFlange(file(name), options);
  if (!r.ok) throw new Error(r.message);
  return r.value;
}

describe("Drawing intake on CAD-style drawings (independent writers)", () => {
  it("chains a LINE/ARC outline into one closed contour and two half ARCs into the bore circle", () => {
    const m = manifest["line-arc-cover.dxf"];
    const v = read("line-arc-cover.dxf");
    expect(v.reading.outlineText).toMatch(/^closed chain of 4 ARC \+ 4 LINE on layer OUTLINE, 400 × 260 mm$/);
    expect(v.outline.kind).toBe("polygon");
    if (v.outline.kind !== "polygon") return;
    const xs = v.outline.points.map((p) => p.x);
    const ys = v.outline.points.map((p) => p.y);
    expect(Math.max(...xs) - Math.min(...xs)).toBeCloseTo(m.outline.width, 6);
    expect(Math.max(...ys) - Math.min(...ys)).toBeCloseTo(m.outline.height, 6);
    expect(v.bore?.diameterMm).toBeCloseTo(m.boreDiameterMm, 6);
    expectSameHoles(v.boltHoles, m.holes);
    for (const h of v.boltHoles) expect(h.diameterMm).toBeCloseTo(m.holeDiameterMm, 6);
    // Every entity is accounted for: 10 holes, 4 + 4 outline pieces, 2 bore arcs.
    const used = v.reading.tally.filter((t) => t.status === "used");
    expect(used.reduce((s, t) => s + t.count, 0)).toBe(20);
    const p = prepareImport({ dxfText: file("line-arc-cover.dxf"), name: "Cover", units: "SI" });
    if (!p.ok) throw new Error(p.message);
    expectSameHoles(
      getBoltPoints(p.built.design).map((q) => ({ xMm: q.x, yMm: q.y })),
      m.holes,
    );
  });

  it("expands nested INSERTs with position, scale and rotation, and reports the block entities", () => {
    const m = manifest["insert-holes.dxf"];
    const v = read("insert-holes.dxf");
    expect(v.outline).toEqual({ kind: "circle", diameterMm: expect.closeTo(m.outlineDiameterMm, 6) });
    expect(v.bore?.diameterMm).toBeCloseTo(m.boreDiameterMm, 6);
    expectSameHoles(v.boltHoles, m.holes);
    for (const h of v.boltHoles) expect(h.diameterMm).toBeCloseTo(m.holeDiameterMm, 6);
    const tally = v.reading.tally;
    expect(tally).toContainEqual(
      expect.objectContaining({ type: "CIRCLE", layer: "BOLTS", count: 12, fromBlocks: 12, status: "used" }),
    );
    // The centre-mark crosses (a nested block in each hole) are read and reported as not used.
    expect(tally).toContainEqual(
      expect.objectContaining({
        type: "LINE",
        layer: "BOLTS",
        count: 24,
        fromBlocks: 24,
        status: "not used",
      }),
    );
    expect(tally).toContainEqual(
      expect.objectContaining({ type: "INSERT", count: 12, detail: "expanded: block HOLE" }),
    );
    const p = prepareImport({ dxfText: file("insert-holes.dxf"), name: "Flange", units: "SI" });
    if (!p.ok) throw new Error(p.message);
    expect(p.built.design.boltPath).toEqual({
      kind: "circle",
      diameterMm: expect.closeTo(m.boltCircleDiameterMm, 6),
    });
  });

  it("switches dimension, text and title-block layers off by default; the hole pattern's contour wins over the border", () => {
    const m = manifest["layered-title-block.dxf"];
    const v = read("layered-title-block.dxf");
    expect(
      v.reading.layers
        .filter((l) => !l.on)
        .map((l) => l.name)
        .sort(),
    ).toEqual(m.offByDefault);
    expect(v.reading.outlineText).toBe("LWPOLYLINE on layer OUTLINE, 300 × 200 mm");
    expectSameHoles(v.boltHoles, m.holes);
    // With every layer switched on, the border (which encloses the flange and its holes too) still
    // loses to the smaller contour that holds the hole pattern.
    const all = read("layered-title-block.dxf", { layersOn: v.reading.layers.map((l) => l.name) });
    expect(all.reading.outlineText).toBe("LWPOLYLINE on layer OUTLINE, 300 × 200 mm");
    expectSameHoles(all.boltHoles, m.holes);
    expect(all.warnings.join(" ")).toMatch(/TITLE-BLOCK, 574 × 400 mm holds the same holes/);
    // Switching the holes' layer off refuses, naming the contours and entities looked at.
    const noHoles = parseDxfFlange(file("layered-title-block.dxf"), { layersOn: ["OUTLINE"] });
    expect(noHoles.ok).toBe(false);
    if (noHoles.ok) return;
    expect(noHoles.message).toMatch(/No bolt holes found/);
    expect(noHoles.message).toMatch(/LWPOLYLINE on layer OUTLINE, 300 × 200 mm \(0 circle\(s\) inside\)/);
    expect(noHoles.message).toMatch(/skipped .*8 CIRCLE.*layer switched off/);
  });

  it("R12 without $INSUNITS: says the unit is not stated and reads inches when switched", () => {
    const m = manifest["r12-inch-cover.dxf"];
    expect(m.hasInsunits).toBe(false);
    const asMm = parseDxfFlange(file("r12-inch-cover.dxf"));
    if (!asMm.ok) throw new Error(asMm.message);
    expect(asMm.value.reading.units).toMatchObject({ stated: false, assumed: "mm" });
    expect(asMm.value.reading.sizeInUnits).toEqual({
      width: expect.closeTo(m.outlineInches.width, 9),
      height: expect.closeTo(m.outlineInches.height, 9),
    });
    // Read as mm the geometry is no valid joint; the refusal names the outline it read.
    const refused = prepareImport({ dxfText: file("r12-inch-cover.dxf"), name: "Cover", units: "US" });
    expect(refused).toMatchObject({
      ok: false,
      field: "design",
      message: expect.stringMatching(/closed chain of 4 ARC \+ 4 LINE on layer 0, 14 × 9.25 mm/),
    });
    const inches = read("r12-inch-cover.dxf", { unit: "in" });
    expect(inches.unitsLabel).toMatch(/^inches/);
    expectSameHoles(
      inches.boltHoles,
      m.holesIn.map((h: { x: number; y: number }) => ({ x: h.x * 25.4, y: h.y * 25.4 })),
    );
    expect(inches.boltHoles[0].diameterMm).toBeCloseTo(m.holeDiameterIn * 25.4, 9);
    const ok = prepareImport({
      dxfText: file("r12-inch-cover.dxf"),
      name: "Cover",
      units: "US",
      dxfUnit: "in",
    });
    if (!ok.ok) throw new Error(ok.message);
    expect(validateJointDesign(ok.built.design)).toEqual([]);
  });

  it("samples a closed rational SPLINE outline: the NURBS circle comes back round to 1e-9", () => {
    const m = manifest["spline-outline.dxf"];
    const v = read("spline-outline.dxf");
    expect(v.reading.outlineText).toMatch(/^SPLINE on layer 0/);
    if (v.outline.kind !== "polygon") throw new Error("expected a sampled outline");
    // The NURBS circle (Piegl & Tiller, The NURBS Book, 2nd ed., §7.3) is exact: every sample lies on radius R.
    for (const p of v.outline.points) expect(Math.hypot(p.x, p.y)).toBeCloseTo(m.radiusMm, 9);
    expectSameHoles(v.boltHoles, m.holes);
  });

  it("samples an ELLIPSE outline", () => {
    const m = manifest["ellipse-outline.dxf"];
    const v = read("ellipse-outline.dxf");
    expect(v.reading.outlineText).toBe("ELLIPSE on layer 0, 520 × 360 mm");
    if (v.outline.kind !== "polygon") throw new Error("expected a sampled outline");
    const [a, b] = m.semiAxesMm;
    for (const p of v.outline.points) expect((p.x / a) ** 2 + (p.y / b) ** 2).toBeCloseTo(1, 9);
    expectSameHoles(v.boltHoles, m.holes);
    const p = prepareImport({ dxfText: file("ellipse-outline.dxf"), name: "Manway", units: "SI" });
    if (!p.ok) throw new Error(p.message);
    expect(validateJointDesign(p.built.design)).toEqual([]);
  });

  it("an outline left open names the chain and where it stops", () => {
    // The LINE/ARC cover with its first LINE removed: no closed outline remains.
    const lines = file("line-arc-cover.dxf").split(/\r?\n/);
    let i = 0;
    while (!(lines[i].trim() === "0" && lines[i + 1].trim() === "LINE")) i += 2;
    let j = i + 2;
    while (lines[j].trim() !== "0") j += 2;
    const cut = [...lines.slice(0, i), ...lines.slice(j)].join("\n");
    const r = parseDxfFlange(cut);
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.message).toMatch(/No bolt holes found|no closed outline/);
    expect(r.reading?.tally).toContainEqual(
      expect.objectContaining({
        type: "LINE",
        layer: "OUTLINE",
        status: "not used",
        detail: expect.stringMatching(/open chain of .*ends do not meet/),
      }),
    );
  });

  it("reads a mirrored CIRCLE (extrusion 0,0,−1) where CAD shows it: x flipped", () => {
    const w = new DxfWriter();
    w.setUnits(Units.Millimeters);
    // Object coordinates (100, 0) with a downward normal lie at world (−100, 0).
    w.addCircle(point3d(100, 0, 0), 80, { extrusion: point3d(0, 0, -1) });
    for (let i = 0; i < 6; i++) {
      const a = (i * Math.PI) / 3;
      w.addCircle(point3d(-100 + 60 * Math.cos(a), 60 * Math.sin(a), 0), 6);
    }
    const r = parseDxfFlange(w.stringify());
    if (!r.ok) throw new Error(r.message);
    expect(r.value.centreMm.x).toBeCloseTo(-100, 9);
    expect(r.value.boltHoles).toHaveLength(6);
  });
});
