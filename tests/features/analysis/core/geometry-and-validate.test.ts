import { describe, expect, it } from "vitest";
import {
  bandWidthOnFaceMm,
  boreDepthBelowOutlineMm,
  getBoltPath,
  getBoltPoint,
  getNeighbourSpacings,
  isPointInOutline,
  outlineToPolyline,
  placeBoltsEqually,
  snapToBoltPath,
} from "@/features/analysis/core/geometry";
import { pointAtArcLength, projectOntoPath } from "@/features/analysis/core/path";
import { validateJointDesign } from "@/features/analysis/core/validate";
import { circularFlange, rectangularCover } from "./fixtures";

describe("geometry", () => {
  it("circle path length π·D, s = 0 at the top, clockwise", () => {
    const p = getBoltPath({ kind: "circle", diameterMm: 300 }, { kind: "circle", diameterMm: 200 });
    expect(p.lengthMm).toBeCloseTo(Math.PI * 200, 9);
    const top = pointAtArcLength(p, 0);
    expect(top.x).toBeCloseTo(0, 9);
    expect(top.y).toBeCloseTo(100, 9);
    const q = pointAtArcLength(p, p.lengthMm / 4);
    expect(q.x).toBeCloseTo(100, 9);
    expect(q.y).toBeCloseTo(0, 9);
  });
  it("offset of a rounded rectangle: exact length 2(w+h) − (8 − 2π)·r'", () => {
    const p = getBoltPath(
      { kind: "rectangle", widthMm: 600, heightMm: 400, cornerRadiusMm: 30 },
      { kind: "offset", offsetMm: 25 },
    );
    expect(p.lengthMm).toBeCloseTo(2 * 550 + 2 * 350 - (8 - 2 * Math.PI) * 5, 9);
  });
  it("placing N bolts equally straddles the centre lines (first at half a pitch from the top)", () => {
    const bolts = placeBoltsEqually(800, 8);
    expect(bolts[0]).toEqual({ id: "b1", sMm: 50 });
    expect(bolts[7].id).toBe("b8");
  });
  it("projecting a point returns its arc position and off-path distance; the round trip is exact", () => {
    const p = getBoltPath({ kind: "obround", lengthMm: 900, widthMm: 600 }, { kind: "offset", offsetMm: 40 });
    for (const s of [0, 123.4, 700, 1500]) {
      const pt = getBoltPoint(p, { id: "x", sMm: s, offPathMm: 7 });
      const r = projectOntoPath(p, pt);
      expect(r.sMm).toBeCloseTo(s, 6);
      expect(r.offPathMm).toBeCloseTo(7, 6);
    }
    expect(
      snapToBoltPath(
        { outline: { kind: "circle", diameterMm: 300 }, boltPath: { kind: "circle", diameterMm: 200 } },
        { x: 0, y: 110 },
      ),
    ).toEqual({ sMm: 0, offPathMm: expect.closeTo(10, 9) });
  });
  it("pitch and chord between neighbours", () => {
    const d = circularFlange({
      boltCount: 4,
      boltCircleMm: 200,
      outsideDiameterMm: 260,
      boreMm: 100,
      gasket: { innerDiameterMm: 120, outerDiameterMm: 140 },
    });
    const sp = getNeighbourSpacings(d);
    expect(sp).toHaveLength(4);
    expect(sp[0].pitchMm).toBeCloseTo((Math.PI * 200) / 4, 9);
    expect(sp[0].chordMm).toBeCloseTo(100 * Math.SQRT2, 9);
    expect(sp[3].toId).toBe("b1");
  });
  it("point in outline and polylines for every outline kind", () => {
    expect(
      isPointInOutline(
        { kind: "rectangle", widthMm: 100, heightMm: 50, cornerRadiusMm: 10 },
        { x: 49, y: 24 },
      ),
    ).toBe(false);
    expect(
      isPointInOutline(
        { kind: "rectangle", widthMm: 100, heightMm: 50, cornerRadiusMm: 10 },
        { x: 40, y: 15 },
      ),
    ).toBe(true);
    expect(
      isPointInOutline(
        {
          kind: "polygon",
          points: [
            { x: 0, y: 0 },
            { x: 10, y: 0 },
            { x: 0, y: 10 },
          ],
        },
        { x: 2, y: 2 },
      ),
    ).toBe(true);
    expect(outlineToPolyline({ kind: "circle", diameterMm: 100 }, 1).length).toBeGreaterThan(300);
  });
});

describe("a new band gasket fits the face (internal)", () => {
  // 600 × 400 r30 cover over a 480 × 280 r20 opening: the face is 60 mm deep along the sides.
  const { outline, bore } = rectangularCover();
  const o = { preferredMm: 20, minMm: 5, gapMm: 3 };
  it("the bore's nearest point lies 60 mm inside the outline", () => {
    expect(boreDepthBelowOutlineMm(outline, bore)).toBeCloseTo(60, 6);
    expect(boreDepthBelowOutlineMm(outline, null)).toBe(Infinity);
  });
  it("narrows the band to the room left, keeps the preferred width without a bore or without room", () => {
    expect(bandWidthOnFaceMm(outline, bore, 30, o)).toBe(20); // room 27 mm
    expect(bandWidthOnFaceMm(outline, bore, 40, o)).toBeCloseTo(17, 6); // room 17 mm
    expect(bandWidthOnFaceMm(outline, bore, 54, o)).toBe(20); // room 3 mm < 5: left to the validator
    expect(bandWidthOnFaceMm(outline, null, 54, o)).toBe(20);
  });
});

describe("validateJointDesign names the field of every problem", () => {
  it("accepts the fixtures", () => {
    expect(validateJointDesign(circularFlange())).toEqual([]);
    expect(validateJointDesign(rectangularCover())).toEqual([]);
  });
  it("bolt outside the outline → bolts[i].position", () => {
    const d = circularFlange();
    d.bolts[3] = { ...d.bolts[3], offPathMm: 30 };
    expect(validateJointDesign(d)).toContainEqual({
      path: "bolts[3].position",
      message: "bolt hole lies outside the flange outline",
    });
  });
  it("a band gasket reaching over the bore is refused; one inside the face is accepted (internal)", () => {
    // 600 × 400 cover, opening 480 × 280: a 60 mm face. Bolts at 25 mm with 18 mm holes.
    const band = (centreOffsetMm: number) => {
      const d = rectangularCover();
      d.gasket = {
        kind: "ring",
        geometry: { kind: "band", centreOffsetMm, widthMm: 20 },
        material: d.gasket.material,
      };
      return validateJointDesign(d);
    };
    expect(band(45)).toEqual([]); // inner edge at 55 mm, inside the 60 mm face
    expect(band(55)).toContainEqual({
      path: "gasket.geometry.centreOffsetMm",
      message:
        "ring gasket band reaches over the bore: its inner edge (centre offset + width/2) lies inside the opening",
    });
  });
  it("overlapping holes, ring gasket over a hole, bolt count limits, zero/NaN dimensions", () => {
    const d = circularFlange();
    d.bolts[2] = { ...d.bolts[2], sMm: d.bolts[1].sMm + 5 };
    expect(
      validateJointDesign(d).some(
        (i) => i.path === "bolts[2].position" && /overlaps the hole/.test(i.message),
      ),
    ).toBe(true);
    const g = circularFlange({ gasket: { innerDiameterMm: 182, outerDiameterMm: 235 } });
    expect(
      validateJointDesign(g).some((i) => i.path === "gasket.geometry" && /overlaps the hole/.test(i.message)),
    ).toBe(true);
    const many = circularFlange();
    many.bolts = placeBoltsEqually(1000, 10_000);
    expect(validateJointDesign(many)[0].path).toBe("bolts");
    const none = circularFlange();
    none.bolts = [];
    expect(validateJointDesign(none)[0].path).toBe("bolts");
    const zero = circularFlange();
    zero.outline = { kind: "circle", diameterMm: 0 };
    expect(validateJointDesign(zero)[0].path).toBe("outline.diameterMm");
    const nan = circularFlange();
    nan.layers[0] = { role: "flange", thicknessMm: Number.NaN, materialName: "x", modulusMpa: 200_000 };
    expect(validateJointDesign(nan)[0]).toEqual({
      path: "layers[0].thicknessMm",
      message: "must be a finite number",
    });
  });
});
