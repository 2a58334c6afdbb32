import { describe, expect, it } from "vitest";
import Drawing from "dxf-writer";
import { getBoltPoints } from "@/features/analysis/core/geometry";
import { parseBoltCsv } from "@/features/imports/model/parse-bolt-csv";
import { prepareImport } from "@/features/imports/model/prepare-import";

describe("bolt positions from CSV", () => {
  it("reads x, y and d columns in mm, or inches when asked", () => {
    const r = parseBoltCsv("x,y,d\n100,0,22\n0,100,22\n-100,0,22\n");
    expect(r).toMatchObject({
      ok: true,
      holes: [
        { xMm: 100, yMm: 0, diameterMm: 22 },
        { xMm: 0, yMm: 100, diameterMm: 22 },
        { xMm: -100, yMm: 0, diameterMm: 22 },
      ],
    });
    const inches = parseBoltCsv("X,Y\n1,2\n3,4\n", { unit: "in", defaultDiameterMm: 20 });
    expect(inches).toMatchObject({
      ok: true,
      holes: [
        { xMm: 25.4, yMm: 2 * 25.4, diameterMm: 20 },
        { xMm: 3 * 25.4, yMm: 4 * 25.4, diameterMm: 20 },
      ],
    });
  });

  it("names the row and the column of every bad value", () => {
    const r = parseBoltCsv("x,y,d\n100,0,22\n0,abc,22\n,5,22\n");
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.rowErrors).toEqual([
      { line: 3, field: "y", message: 'row 3: y "abc" is not a number' },
      { line: 4, field: "x", message: "row 4: x is missing" },
    ]);
    expect(r.message).toBe('row 3: y "abc" is not a number');
  });

  it("refuses a file without x and y columns", () => {
    expect(parseBoltCsv("a,b\n1,2\n")).toMatchObject({
      ok: false,
      message: expect.stringMatching(/columns x and y/),
    });
  });

  it("in the intake, CSV bolt positions replace the DXF holes and keep their exact coordinates", () => {
    const d = new Drawing();
    d.drawCircle(0, 0, 200);
    for (const [x, y] of [
      [150, 0],
      [-150, 0],
    ])
      d.drawCircle(x, y, 9);
    const rows = Array.from({ length: 6 }, (_, i) => {
      const a = (i * Math.PI) / 3;
      return [Math.round(160 * Math.cos(a) * 1000) / 1000, Math.round(160 * Math.sin(a) * 1000) / 1000];
    });
    const csv = ["x,y,d", ...rows.map(([x, y]) => `${x},${y},18`)].join("\n");
    const r = prepareImport({ dxfText: d.toDxfString(), csv: csv, name: "CSV pattern", units: "SI" });
    if (!r.ok) throw new Error(r.message);
    expect(r.summary).toMatchObject({ boltsFrom: "csv", holeCount: 6, holeDiameterMm: 18 });
    const pts = getBoltPoints(r.built.design);
    for (const [x, y] of rows)
      expect(Math.min(...pts.map((p) => Math.hypot(p.x - x, p.y - y)))).toBeLessThan(1e-3);
    const bad = prepareImport({
      dxfText: d.toDxfString(),
      csv: "x,y\n1,2\n3,oops\n",
      name: "x",
      units: "SI",
    });
    expect(bad).toMatchObject({ ok: false, field: "csv", message: 'row 3: y "oops" is not a number' });
  });
});
