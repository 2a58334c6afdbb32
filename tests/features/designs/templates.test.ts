import { describe, expect, it } from "vitest";
import { z } from "zod";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { jointDesignSchema } from "@/features/analysis/schema";
import { buildDesignFromTemplate, type TemplateInput } from "@/features/designs/model/templates";
import { TEMPLATE_CHOICES } from "@/features/designs/model/template-fields";
import { newDesignFormSchema } from "@/features/designs/template-schema";
import { withGasketForm } from "@/features/editor/model/gasket-form";
import { COVER_TEMPLATE } from "../../setup/fixtures";

// Templates in Node: each builds a document the core's schema accepts and the core analyses
// with finite numbers everywhere; the new-design form's defaults are valid; bad input in every
// field gets a message at that field.
const meta = { name: "Template check", equipmentTag: "E-2107", units: "SI" as const };

function defaultsOf(kind: string): Record<string, string> {
  const choice = TEMPLATE_CHOICES.find((c) => c.kind === kind)!;
  return {
    name: "Template check",
    equipmentTag: "E-2107",
    kind,
    ...Object.fromEntries(choice.fields.map((f) => [f.name, f.defaultValue])),
  };
}

function nonFiniteNumbers(value: unknown, path = "", out: string[] = []): string[] {
  if (typeof value === "number" && !Number.isFinite(value)) out.push(path);
  else if (Array.isArray(value)) value.forEach((v, i) => nonFiniteNumbers(v, `${path}[${i}]`, out));
  else if (value && typeof value === "object")
    for (const [k, v] of Object.entries(value)) nonFiniteNumbers(v, `${path}.${k}`, out);
  return out;
}

describe("design templates", () => {
  for (const choice of TEMPLATE_CHOICES) {
    it(`${choice.label}: the form defaults build a valid document that the core analyses without NaN`, () => {
      const parsed = newDesignFormSchema.safeParse(defaultsOf(choice.kind));
      expect(parsed.success ? [] : z.flattenError(parsed.error).fieldErrors).toEqual([]);
      const { name, equipmentTag, ...template } = parsed.data!;
      const document = buildDesignFromTemplate({ ...meta, name, equipmentTag }, template as TemplateInput);
      const checked = jointDesignSchema.safeParse(document);
      expect(checked.success ? [] : checked.error.issues.map((i) => i.message)).toEqual([]);
      expect(document.bolts.length).toBeGreaterThanOrEqual(3);
      const result = analyzeJoint(document);
      expect(nonFiniteNumbers(result)).toEqual([]);
      expect(JSON.stringify(result)).not.toMatch(/NaN|Infinity/);
      expect(result.summary.minGasketStressMpa).toBeGreaterThan(0);
    });
  }

  it("places the bolts at equal pitch straddling the top centre line (first bolt half a pitch from s = 0)", () => {
    const d = buildDesignFromTemplate(meta, {
      kind: "circular-flange",
      outsideDiameterMm: 400,
      boreDiameterMm: 200,
      boltCircleDiameterMm: 340,
      boltCount: 12,
      boltSize: "M20",
      flangeThicknessMm: 30,
    });
    const pitch = (Math.PI * 340) / 12;
    expect(d.bolts[0].sMm).toBeCloseTo(pitch / 2, 6);
    expect(d.bolts[11].sMm - d.bolts[10].sMm).toBeCloseTo(pitch, 6);
  });

  it("takes OD, bolt circle and bolting of a catalogue pipe flange from the ASME B16.5 Class 150 row", () => {
    const d = buildDesignFromTemplate(meta, {
      kind: "pipe-flange",
      flangeTemplateId: "asme-b16.5-cl150-nps6",
      flangeThicknessMm: 25,
    });
    expect(d.outline).toEqual({ kind: "circle", diameterMm: 11 * 25.4 });
    expect(d.boltPath).toEqual({ kind: "circle", diameterMm: 9.5 * 25.4 });
    expect(d.bolts).toHaveLength(8);
    expect(d.fastener.designation).toBe("3/4");
    expect(d.templateId).toBe("asme-b16.5-cl150-nps6");
  });
});

describe("full-face gaskets from the interface", () => {
  const params = {
    outsideDiameterMm: 400,
    boreDiameterMm: 200,
    boltCircleDiameterMm: 340,
    boltCount: 12,
    boltSize: "M20" as const,
    flangeThicknessMm: 30,
  };
  it("the Full-face round flange template puts one elastomer sheet over the face; Service / notes starts empty", () => {
    const d = buildDesignFromTemplate(meta, { kind: "full-face-flange", ...params });
    expect(d.gasket.kind).toBe("full-face");
    expect(d.gasket.material.catalogueId).toBe("elastomer-cotton-insertion");
    expect(d.description).toBeUndefined();
    // The stress is reported along the bolt path, where the sheet must seal between the bolts.
    expect(analyzeJoint(d).gasketStress.pathKind).toBe("bolt-path");
  });

  it("the editor's ring/full-face switch keeps the material and puts a new ring inside the holes", () => {
    const ring = buildDesignFromTemplate(meta, { kind: "circular-flange", ...params });
    const full = { ...ring, gasket: withGasketForm(ring, "full-face") };
    expect(full.gasket).toEqual({ kind: "full-face", material: ring.gasket.material });
    const back = withGasketForm(full, "ring");
    expect(back).toEqual(ring.gasket); // the template's ring: bore + 2·3 mm to bolt circle − hole − 2·3 mm
    expect(jointDesignSchema.safeParse({ ...full, gasket: back }).success).toBe(true);
    const cover = buildDesignFromTemplate(meta, COVER_TEMPLATE);
    const band = withGasketForm({ ...cover, gasket: withGasketForm(cover, "full-face") }, "ring");
    expect(band).toEqual(cover.gasket); // the cover template's band sits where the switch puts it
  });
});

describe("new-design form validation", () => {
  const numberFields = [
    "widthMm",
    "heightMm",
    "boltEdgeDistanceMm",
    "boltCount",
    "coverThicknessMm",
    "flangeThicknessMm",
    "gasketWidthMm",
  ];
  const badValues: [string, string, RegExp][] = [
    ["empty", "", /is required/],
    ["negative", "-20", /greater than zero|at least/],
    ["absurdly large", "1e9", /at most/],
    ["non-numeric", "twelve", /must be a number/],
  ];
  for (const field of numberFields) {
    for (const [what, value, message] of badValues) {
      it(`rectangular cover: ${what} ${field} gets a message at that field`, () => {
        const result = newDesignFormSchema.safeParse({ ...defaultsOf("rectangular-cover"), [field]: value });
        expect(result.success).toBe(false);
        const errors = z.flattenError(result.error!).fieldErrors as Record<string, string[]>;
        expect(Object.keys(errors)).toEqual([field]);
        expect(errors[field][0]).toMatch(message);
      });
    }
  }

  it("an empty name, an unknown bolt size and an unknown template are each named", () => {
    const r1 = newDesignFormSchema.safeParse({
      ...defaultsOf("obround-manway"),
      name: "  ",
      boltSize: "M99",
    });
    expect(Object.keys(z.flattenError(r1.error!).fieldErrors).sort()).toEqual(["boltSize", "name"]);
    const r2 = newDesignFormSchema.safeParse({ name: "x", kind: "teapot" });
    expect(z.flattenError(r2.error!).fieldErrors).toHaveProperty("kind");
  });

  it("bolt holes outside the flange: a bolt circle too close to the edge is refused at the bolt circle", () => {
    const r = newDesignFormSchema.safeParse({
      ...defaultsOf("circular-flange"),
      boltCircleDiameterMm: "395",
    });
    expect(z.flattenError(r.error!).fieldErrors).toEqual({
      boltCircleDiameterMm: [expect.stringMatching(/inside the outside diameter/)],
    });
  });

  it("bolt holes outside the cover: an edge distance smaller than the hole radius is refused at the edge distance", () => {
    const r = newDesignFormSchema.safeParse({ ...defaultsOf("rectangular-cover"), boltEdgeDistanceMm: "8" });
    expect(z.flattenError(r.error!).fieldErrors).toEqual({
      boltEdgeDistanceMm: [expect.stringMatching(/stay inside the edge/)],
    });
  });

  it("too many bolts for the path is refused once, at the bolt count", () => {
    const r = newDesignFormSchema.safeParse({ ...defaultsOf("rectangular-cover"), boltCount: "200" });
    expect(z.flattenError(r.error!).fieldErrors).toEqual({ boltCount: [expect.stringMatching(/too many/)] });
  });

  it("polygon vertices that are not number pairs are refused at the vertices", () => {
    const r = newDesignFormSchema.safeParse({ ...defaultsOf("polygon-cover"), points: "0, 0\n100, 0\nabc" });
    expect(Object.keys(z.flattenError(r.error!).fieldErrors)).toEqual(["points"]);
  });
});
