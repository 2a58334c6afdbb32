import { describe, expect, it } from "vitest";
import { parseBoltCsv } from "@/features/imports/model/parse-bolt-csv";

describe("bolt positions from CSV", () => {
  it("reads x, y and d columns in mm, or inches when asked", () => {
    const r = parseBoltCsv("x,y,d\n100,0,22\n0,100,22\n-100,0,22\n");
    expect(r).toEqual({ ok: true, holes: [{ xMm: 100, yMm: 0, diameterMm: 22 }, { xMm: 0, yMm: 100, diameterMm: 22 }, { xMm: -100, yMm: 0, diameterMm: 22 }] });
    const inches = parseBoltCsv("X,Y\n1,2\n3,4\n", { unit: "in", defaultDiameterMm: 20 });
    expect(inches).toEqual({ ok: true, holes: [{ xMm: 25.4, yMm: 2 * 25.4, diameterMm: 20 }, { xMm: 3 * 25.4, yMm: 4 * 25.4, diameterMm: 20 }] });
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
    expect(parseBoltCsv("a,b\n1,2\n")).toMatchObject({ ok: false, message: expect.stringMatching(/columns x and y/) });
  });
});
