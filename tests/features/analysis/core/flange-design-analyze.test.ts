/**
 * The flange design as analyzeJoint emits it: standard check records with rule ids, defaults that keep
 * existing documents analysing, the entered bolt allowable for bolting ASME lists none for, and the
 * flange material catalogue. Oracles: the equations themselves (see flange-design.test.ts for the
 * published worked examples); catalogue values are [mem] and are only checked against their own rows.
 */
import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { validateJointDesign } from "@/features/analysis/core/validate";
import { jointDesignSchema } from "@/features/analysis/schema";
import {
  FLANGE_MATERIALS,
  getFlangeMaterialById,
  valueAtTemperature,
} from "@/features/analysis/core/catalogue/flange-materials";
import { psiToMpa } from "@/features/analysis/core/units";
import type { JointDesign } from "@/features/analysis/core/design";
import { circularFlange, rectangularCover } from "./fixtures";

const rule = (id: string) => id.split(":")[0];

function weldNeck(extra: Partial<NonNullable<JointDesign["flangeDesign"]>> = {}): JointDesign {
  return {
    ...circularFlange({ units: "US", pressureMpa: 2 }),
    flangeDesign: {
      kind: "integral-hub",
      hub: { g0Mm: 7.1, g1Mm: 14.2, hMm: 44 },
      flangeMaterialId: "sa-105",
      ...extra,
    },
  };
}

describe("flange design in analyzeJoint", () => {
  it("a design without flange inputs keeps analysing: the flange rule says what is missing (not applicable)", () => {
    const r = analyzeJoint(circularFlange());
    const scope = r.checks.find((c) => c.id === "flange.app2.scope")!;
    expect(scope.status).toBe("not-applicable");
    expect(scope.note).toMatch(/Flange type not entered/);
    expect(
      r.checks.filter((c) => c.id.startsWith("flange.")).every((c) => c.status === "not-applicable"),
    ).toBe(true);
    expect(r.flangeDesign.inputsEntered).toBe(false);
  });
  it("an integral hubbed flange gets SH, SR, ST, the two combinations and J for both conditions, as check records", () => {
    const r = analyzeJoint(weldNeck());
    const ids = r.checks.filter((c) => c.id.startsWith("flange.app2.")).map((c) => c.id);
    for (const cond of ["operating", "seating"])
      for (const k of ["sh", "sr", "st", "sh-sr", "sh-st", "rigidity"])
        expect(ids).toContain(`flange.app2.${k}:${cond}`);
    const rules = new Set(ids.map(rule));
    expect(rules).toEqual(
      new Set([
        "flange.app2.scope",
        "flange.app2.sh",
        "flange.app2.sr",
        "flange.app2.st",
        "flange.app2.sh-sr",
        "flange.app2.sh-st",
        "flange.app2.rigidity",
      ]),
    );
    const sh = r.checks.find((c) => c.id === "flange.app2.sh:operating")!;
    const sf = valueAtTemperature(getFlangeMaterialById("sa-105")!.allowable, 20)!;
    expect(sh.limit).toBeCloseTo(1.5 * sf, 6);
    expect(sh.status).toBe(sh.value! <= sh.limit! ? "pass" : "fail");
    expect(sh.source).toMatch(/Appendix 2/);
    expect(r.flangeDesign.appendix2!.hub!.F).toBeGreaterThan(0);
  });
  it("a thicker flange layer lowers every Appendix 2 stress of the analysed joint", () => {
    const thin = analyzeJoint(weldNeck());
    const d = weldNeck();
    d.layers = d.layers.map((l) => (l.role === "flange" ? { ...l, thicknessMm: l.thicknessMm * 1.5 } : l));
    const thick = analyzeJoint(d);
    for (const k of [0, 1]) {
      expect(thick.flangeDesign.appendix2!.conditions[k].stMpa!).toBeLessThan(
        thin.flangeDesign.appendix2!.conditions[k].stMpa!,
      );
      expect(thick.flangeDesign.appendix2!.conditions[k].srMpa!).toBeLessThan(
        thin.flangeDesign.appendix2!.conditions[k].srMpa!,
      );
    }
  });
  it("an entered flange allowable wins over the catalogue and is named as the source", () => {
    const r = analyzeJoint(
      weldNeck({ flangeAllowable: { designMpa: 100, ambientMpa: 120, source: "owner's spec KR-07" } }),
    );
    const st = r.checks.find((c) => c.id === "flange.app2.st:seating")!;
    expect(st.limit).toBe(120);
    expect(st.source).toMatch(/owner's spec KR-07/);
  });
  it("UG-99 test pressure suggestion: 1.3 × P × S(ambient)/S(design), shown as a suggestion with its source", () => {
    const d = weldNeck();
    d.loads.designTemperatureC = 370;
    const r = analyzeJoint(d);
    const S = getFlangeMaterialById("sa-105")!.allowable;
    expect(r.flangeDesign.hydrotest.suggestedMpa!).toBeCloseTo(
      (1.3 * 2 * valueAtTemperature(S, 20)!) / valueAtTemperature(S, 370)!,
      9,
    );
    expect(r.flangeDesign.hydrotest.source).toMatch(/UG-99/);
    expect(r.flangeDesign.hydrotest.source).toMatch(/suggestion/);
  });
  it("a cover layer with a chosen sketch gets the UG-34 thickness check; a thicker cover passes where a thin one fails", () => {
    const cover = (t: number): JointDesign => ({
      ...rectangularCover({ coverThicknessMm: t }),
      flangeDesign: {
        kind: "not-entered",
        coverSketch: { kind: "catalogue", id: "ug34-j" },
        coverMaterialId: "sa-516-70",
      },
    });
    const thin = analyzeJoint(cover(5)).checks.find((c) => c.id === "flange.ug34.thickness")!;
    const thick = analyzeJoint(cover(60)).checks.find((c) => c.id === "flange.ug34.thickness")!;
    expect(thin.status).toBe("fail");
    expect(thick.status).toBe("pass");
    expect(thick.limit).toBeCloseTo(thin.limit!, 6);
    expect(thick.source).toMatch(/full-face.*\[practice\]/);
    expect(thick.source).toMatch(/C = 0.3/);
  });
});

describe("entered bolt allowable (bolting with no ASME allowable)", () => {
  const iso = () => {
    const d = circularFlange({ designation: "M20", threadSeries: "metric-coarse", holeDiameterMm: 22 });
    d.fastener.materialId = "iso-898-1-8.8";
    return d;
  };
  it("without one, Ab ≥ Am is not applicable and says why: the code lists no allowable for that bolting", () => {
    const r = analyzeJoint(iso());
    const area = r.checks.find((c) => c.id === "asme.app2.bolt-area")!;
    expect(area.status).toBe("not-applicable");
    expect(area.note).toMatch(/lists no allowable bolt stress/);
    expect(area.note).toMatch(/Enter an allowable bolt stress/);
    expect(r.checks.find((c) => c.id === "asme.app2.scope")!.note).toMatch(/no ASME allowable bolt stress/);
  });
  it("with one (and its source), the check runs on it", () => {
    const d = iso();
    d.fastener.enteredAllowable = {
      valueMpa: psiToMpa(25000),
      source: "EN 1591-1 nominal design stress, owner's choice",
    };
    const r = analyzeJoint(d);
    const area = r.checks.find((c) => c.id === "asme.app2.bolt-area")!;
    expect(area.status === "pass" || area.status === "fail").toBe(true);
    expect(area.limit!).toBeCloseTo(
      Math.max(r.asmeAppendix2.wm1N, r.asmeAppendix2.wm2N) / psiToMpa(25000),
      6,
    );
    expect(area.note).toMatch(/entered by the designer: EN 1591-1/);
  });
  it("an entered allowable with no source, an unknown flange material or g1 < g0 is refused with its field path", () => {
    const d = iso();
    d.fastener.enteredAllowable = { valueMpa: 100, source: " " };
    expect(validateJointDesign(d).map((i) => i.path)).toContain("fastener.enteredAllowable.source");
    const w = weldNeck({ flangeMaterialId: "sa-999", hub: { g0Mm: 10, g1Mm: 5, hMm: 20 } });
    const paths = validateJointDesign(w).map((i) => i.path);
    expect(paths).toContain("flangeDesign.flangeMaterialId");
    expect(paths).toContain("flangeDesign.hub.g1Mm");
  });
  it("the zod schema keeps the new inputs (a stored document round-trips them)", () => {
    const w = weldNeck({
      testPressureMpa: 3.2,
      coverSketch: { kind: "entered", c: 0.25, source: "UG-34 sketch (k)" },
    });
    const parsed = jointDesignSchema.parse(w);
    expect(parsed.flangeDesign).toEqual(w.flangeDesign);
  });
});

describe("flange material catalogue (ASME II-D Table 1A / TM-1 [mem])", () => {
  it("every row is tagged with source, edition and confidence, ascending in temperature", () => {
    for (const m of FLANGE_MATERIALS) {
      expect(m.source).toMatch(/II-D/);
      expect(m.edition.length).toBeGreaterThan(0);
      expect(m.confidence).toBe("mem");
      for (const rows of [m.allowable, m.modulus])
        for (let k = 1; k < rows.length; k++) expect(rows[k][0]).toBeGreaterThan(rows[k - 1][0]);
    }
  });
  it("the lookup returns the table rows it was built from, interpolates between them, and has no value above the last", () => {
    for (const m of FLANGE_MATERIALS) {
      for (const [t, s] of m.allowable) expect(valueAtTemperature(m.allowable, t)).toBeCloseTo(s, 9);
      const [t0, s0] = m.allowable[3];
      const [t1, s1] = m.allowable[4];
      expect(valueAtTemperature(m.allowable, (t0 + t1) / 2)).toBeCloseTo((s0 + s1) / 2, 9);
      expect(valueAtTemperature(m.allowable, m.allowable[m.allowable.length - 1][0] + 1)).toBeNull();
    }
  });
});
