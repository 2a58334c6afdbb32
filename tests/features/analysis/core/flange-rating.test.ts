/**
 * Pressure–temperature ratings of standard flanges and the "accepted by its rating" status. The
 * B16.5 rating values are [mem] (never a pass/fail oracle): the tests check that the lookup agrees
 * with the rows it was built from and that the statuses follow the rule, not the remembered numbers.
 */
import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { FLANGE_TEMPLATES, getFlangeTemplateById } from "@/features/analysis/core/catalogue/flange-templates";
import {
  getRatingTable,
  RATING_TABLES,
  ratedPressureBar,
} from "@/features/analysis/core/catalogue/pt-ratings";
import { standardFlangeRating } from "@/features/analysis/core/flange-design/rating";
import { buildPipeFlange } from "@/features/designs/model/templates";
import type { JointDesign } from "@/features/analysis/core/design";

describe("rating tables", () => {
  it("the lookup returns every row it was built from, interpolates linearly between rows, and has nothing above the last", () => {
    for (const t of RATING_TABLES) {
      for (const [temp, bar] of t.rows) expect(ratedPressureBar(t, temp)).toBeCloseTo(bar, 12);
      expect(ratedPressureBar(t, -29)).toBe(t.rows[0][1]);
      if (t.rows.length > 1) {
        const [t0, p0] = t.rows[1];
        const [t1, p1] = t.rows[2];
        expect(ratedPressureBar(t, (t0 + t1) / 2)).toBeCloseTo((p0 + p1) / 2, 12);
      }
      expect(ratedPressureBar(t, t.rows[t.rows.length - 1][0] + 0.1)).toBeNull();
    }
  });
  it("B16.5 Classes 150, 300, 600 in Groups 1.1 and 2.2, and EN 1092-1 PN 10/16/25/40, each tagged with source and edition", () => {
    for (const cls of [150, 300, 600])
      for (const g of ["1.1", "2.2"]) expect(getRatingTable("ASME B16.5", `Class ${cls}`, g)).toBeDefined();
    for (const pn of [10, 16, 25, 40]) {
      const t = RATING_TABLES.find((r) => r.standard === "EN 1092-1" && r.rating === `PN ${pn}`)!;
      expect(ratedPressureBar(t, 20)).toBe(pn); // PN is the bar rating at the reference temperature (EN 1333 definition)
    }
    for (const t of RATING_TABLES) {
      expect(t.source.length).toBeGreaterThan(0);
      expect(t.edition.length).toBeGreaterThan(0);
    }
  });
  it("ratings fall with temperature and rise with class ([calc] shape of every B16.5 table)", () => {
    for (const g of ["1.1", "2.2"]) {
      const [a, b, c] = [150, 300, 600].map((cls) => getRatingTable("ASME B16.5", `Class ${cls}`, g)!);
      for (let k = 0; k < a.rows.length; k++) {
        expect(b.rows[k][1]).toBeGreaterThan(a.rows[k][1]);
        expect(c.rows[k][1]).toBeGreaterThan(b.rows[k][1]);
        if (k > 0) expect(a.rows[k][1]).toBeLessThanOrEqual(a.rows[k - 1][1]);
      }
    }
  });
  it("the templates offer Classes 150, 300 and 600; 300 and 600 rows are tagged [mem]", () => {
    for (const cls of [150, 300, 600])
      expect(FLANGE_TEMPLATES.filter((t) => t.pressureClass === cls).length).toBe(8);
    for (const t of FLANGE_TEMPLATES.filter((x) => x.pressureClass !== 150)) expect(t.confidence).toBe("mem");
  });
});

function nps6(cls: 150 | 300 | 600, pressureMpa: number): JointDesign {
  const d = buildPipeFlange(
    { name: `NPS 6 Class ${cls}`, equipmentTag: "", units: "SI" },
    { flangeTemplateId: `asme-b16.5-cl${cls}-nps6`, flangeThicknessMm: 25.4 },
  );
  d.loads.designPressureMpa = pressureMpa;
  d.loads.designTemperatureC = 38;
  return d;
}

describe("accepted by its rating", () => {
  it("a plain NPS 6 Class 150 flange within its rating: the maximum-pitch rule is accepted by the rating, not a FAIL", () => {
    const r = analyzeJoint(nps6(150, 1.0));
    const maxPitch = r.checks.filter((c) => c.id.startsWith("spacing.max-pitch:"));
    expect(maxPitch.length).toBe(8);
    expect(maxPitch.some((c) => c.status === "fail")).toBe(false);
    expect(maxPitch.every((c) => c.status === "accepted-by-rating" || c.status === "pass")).toBe(true);
    expect(maxPitch[0].note).toMatch(/UG-44/);
    const rating = r.checks.find((c) => c.id === "flange.rating")!;
    expect(rating.status).toBe("pass");
    const table = getRatingTable("ASME B16.5", "Class 150", "1.1")!;
    expect(rating.limit).toBeCloseTo(ratedPressureBar(table, 38)! / 10, 12);
  });
  it("above its rating the flange is designed by rule: the rating check fails and the pitch rule applies as before", () => {
    const table = getRatingTable("ASME B16.5", "Class 150", "1.1")!;
    const over = (ratedPressureBar(table, 38)! / 10) * 1.05;
    const r = analyzeJoint(nps6(150, over));
    expect(r.checks.find((c) => c.id === "flange.rating")!.status).toBe("fail");
    expect(
      r.checks
        .filter((c) => c.id.startsWith("spacing.max-pitch:"))
        .some((c) => c.status === "accepted-by-rating"),
    ).toBe(false);
  });
  it("a template flange whose pattern was changed is no longer the standard flange", () => {
    const d = nps6(150, 1.0);
    d.bolts = d.bolts.slice(0, 6);
    const rating = standardFlangeRating(d)!;
    expect(rating.withinRating).toBe(false);
    expect(rating.reason).toMatch(/No longer the ASME B16.5 Class 150 NPS 6/);
  });
  it("the material group follows the chosen flange material (316 forging → Group 2.2)", () => {
    const d = nps6(300, 3.0);
    d.flangeDesign = { kind: "not-entered", flangeMaterialId: "sa-182-f316" };
    expect(standardFlangeRating(d)!.table!.id).toBe("b16.5-cl300-g2.2");
    expect(getFlangeTemplateById("asme-b16.5-cl300-nps6")!.materialGroup).toBe("1.1");
  });
});
