import { describe, expect, it } from "vitest";
import { INPUT_BOUNDS } from "@/features/analysis/core/bounds";
import { getDesignJsonSchema } from "@/features/analysis/json-schema";
import {
  FIELD_SPECS,
  fromBound,
  layerModulusSpec,
  layerThicknessSpec,
  type NumberFieldSpec,
} from "@/features/editor/model/field-specs";
import { boltingInputSchema, flangeInputSchema, gasketInputSchema } from "@/features/library/schema";

// One bounds table (features/analysis/core/bounds.ts): every number field of the joint data form
// must take exactly the range the published JSON Schema (made from the zod schema) gives the same
// path. Internal check (no published source): it fails when someone types a limit into the form
// or the schema instead of reading the table.

interface Node {
  type?: string;
  properties?: Record<string, Node>;
  items?: Node;
  oneOf?: Node[];
  anyOf?: Node[];
  minimum?: number;
  exclusiveMinimum?: number;
  maximum?: number;
  minItems?: number;
  maxItems?: number;
}

/** Every schema node at a dotted path ("layers.0.thicknessMm"), through unions, nulls and arrays. */
function nodesAt(node: Node, keys: string[]): Node[] {
  const branches = [...(node.oneOf ?? []), ...(node.anyOf ?? [])];
  if (branches.length > 0) return branches.flatMap((b) => nodesAt(b, keys));
  if (keys.length === 0) return node.type === "null" ? [] : [node];
  const [k, ...rest] = keys;
  if (/^\d+$/.test(k)) return node.items ? nodesAt(node.items, rest) : [];
  const next = node.properties?.[k];
  return next ? nodesAt(next, rest) : [];
}

/** The range a schema node enforces, in the field spec's terms. */
function rangeOf(n: Node) {
  if (n.type === "array") return { min: n.minItems, minExclusive: false, max: n.maxItems };
  return n.exclusiveMinimum !== undefined
    ? { min: n.exclusiveMinimum, minExclusive: true, max: n.maximum }
    : { min: n.minimum, minExclusive: false, max: n.maximum };
}
const rangeOfSpec = (s: NumberFieldSpec) => ({
  min: s.min,
  minExclusive: s.minExclusive ?? false,
  max: s.max,
});

// Fields where 0 clears an optional entry (null): the form takes 0, the document's range starts above it.
const ZERO_CLEARS = new Set(["fastener.enteredAllowable.valueMpa"]);
const SCHEMA = getDesignJsonSchema() as Node;

const specs: NumberFieldSpec[] = [
  ...Object.values(FIELD_SPECS),
  layerThicknessSpec(0),
  layerModulusSpec(0),
  // The form's preload field for the two fraction kinds (form-section-assembly.tsx).
  { ...FIELD_SPECS.preloadValue, ...fromBound("preloadFraction") },
];

describe("the joint data form and the design schema read one bounds table", () => {
  it.each(specs.map((s) => [s.path, s] as const))("%s: the form's range is the schema's", (path, spec) => {
    const nodes = nodesAt(SCHEMA, path.split("."));
    expect(nodes.length, `no schema node at ${path}`).toBeGreaterThan(0);
    const ranges = nodes.map(rangeOf);
    if (ZERO_CLEARS.has(path)) {
      expect(spec.min).toBe(0);
      expect(ranges).toContainEqual({ ...rangeOfSpec(spec), min: ranges[0].min, minExclusive: true });
    } else expect(ranges).toContainEqual(rangeOfSpec(spec));
  });

  it("every range a union gives one path is one the form offers for it", () => {
    // assembly.preload.value has a fraction range and a stress range; the form switches with the kind.
    for (const path of new Set(specs.map((s) => s.path))) {
      if (ZERO_CLEARS.has(path)) continue;
      const offered = specs.filter((s) => s.path === path).map(rangeOfSpec);
      for (const r of nodesAt(SCHEMA, path.split(".")).map(rangeOf)) expect(offered).toContainEqual(r);
    }
  });

  it("the Stockroom's input schemas refuse what the design's bounds refuse", () => {
    const gasket = {
      name: "Test sheet",
      gasket_type: "sheet",
      m: "2",
      y_mpa: "20",
      modulus_mpa: "1000",
      thickness_mm: "2",
      source: "maker's data sheet",
    };
    expect(gasketInputSchema.safeParse(gasket).success).toBe(true);
    const over = (field: string, v: number) => gasketInputSchema.safeParse({ ...gasket, [field]: String(v) });
    expect(over("m", INPUT_BOUNDS.gasketFactorM.max * 1.01).success).toBe(false);
    expect(over("modulus_mpa", INPUT_BOUNDS.gasketModulusMpa.max * 1.01).success).toBe(false);
    expect(over("modulus_mpa", INPUT_BOUNDS.gasketModulusMpa.min / 2).success).toBe(false);
    expect(over("thickness_mm", INPUT_BOUNDS.gasketThicknessMm.min / 2).success).toBe(false);
    expect(over("thickness_mm", INPUT_BOUNDS.gasketThicknessMm.max).success).toBe(true);
    const bolting = {
      name: "Test stud",
      modulus_mpa: "205000",
      max_diameter_mm: "64",
      yield_mpa: "725",
      tensile_mpa: "860",
      allowable_mpa: String(INPUT_BOUNDS.allowableStressMpa.max * 1.01),
      source: "maker's data sheet",
    };
    expect(boltingInputSchema.safeParse(bolting).success).toBe(false);
    const flange = {
      standard: "Ours",
      pressure_class: "10 bar",
      size: "DN 5000",
      outside_diameter_mm: String(INPUT_BOUNDS.planDimensionMm.max * 1.01),
      bolt_circle_diameter_mm: "4000",
      bolt_count: "32",
      bolt_designation: "M24",
      bolt_diameter_mm: "24",
      hole_diameter_mm: "26",
      source: "ours",
    };
    expect(flangeInputSchema.safeParse(flange).success).toBe(false);
    expect(flangeInputSchema.safeParse({ ...flange, outside_diameter_mm: "4200" }).success).toBe(true);
  });
});
