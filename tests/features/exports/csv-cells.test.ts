import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { neutralizeCsvText, restoreCsvText, stringifyCsv } from "@/features/forms/csv-cells";
import { buildHoleListCsv } from "@/features/exports/model/hole-list";

// OWASP "CSV Injection": cells starting with = + - @ tab or carriage return are run by
// spreadsheets; they are written with a leading single quote.

describe("CSV cells are safe to open in a spreadsheet", () => {
  it("prefixes a quote to text cells that start with a formula character", () => {
    for (const v of ["=cmd|' /C calc'!A0", "+1+1", "-2+3", "@SUM(A1)", "\t=1", "\r=1", "=", "-"])
      expect(neutralizeCsvText(v), JSON.stringify(v)).toBe(`'${v}`);
    for (const v of ["PTFE sheet", "ASME B16.5", "", "a=b", "1/2-13 UNC", " =1"])
      expect(neutralizeCsvText(v), JSON.stringify(v)).toBe(v);
  });

  it("leaves numbers as numbers: JavaScript numbers and decimal text such as -12.5", () => {
    for (const v of ["-12.5", "+3", "-0.0010", "1e-3", "-1.5E+6", "-.5"])
      expect(neutralizeCsvText(v), v).toBe(v);
    expect(stringifyCsv([[-12.5, "-12.5000", "-12.5 mm", null, undefined]])).toBe(
      "-12.5,-12.5000,'-12.5 mm,,\n",
    );
  });

  it("round-trips every value exactly, also values that already start with quotes", () => {
    const values = ["=x", "'=x", "''=x", "'-12.5", "-12.5", "'hello", "'", "''", "@", "plain", "\t\t", "'\r"];
    for (const v of values) expect(restoreCsvText(neutralizeCsvText(v)), JSON.stringify(v)).toBe(v);
    // A hand-written cell without the quote is read as it is.
    expect(restoreCsvText("'hello")).toBe("'hello");
    expect(restoreCsvText("'-12.5")).toBe("'-12.5");
  });

  it("the hole list quotes a hostile bolt id and size but keeps negative coordinates numeric", () => {
    const csv = buildHoleListCsv(
      { units: "SI", fastener: { holeDiameterMm: 22, designation: "@M20" } as never },
      [
        {
          number: 1,
          id: "=cmd|' /C calc'!A0",
          angleDeg: 270,
          xMm: -120.5,
          yMm: 0,
          tighteningOrder: 1,
        } as never,
      ],
    );
    const [, row] = parse(csv) as string[][];
    expect(row[1]).toBe("'=cmd|' /C calc'!A0");
    expect(row[3]).toBe("-120.5000");
    expect(row[6]).toBe("'@M20");
  });
});
