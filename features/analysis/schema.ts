/**
 * zod schema of the joint design document (features/analysis/core/design.ts). Types and ranges
 * are checked here, and each schema `satisfies z.ZodType<…>` of the core's type, so what it
 * parses is a document of that type (a required field the core adds or retypes and the schema
 * misses is a compile error; a new optional field the schema lacks is not caught, zod strips it); geometric validity (bolts inside the outline, overlapping holes, a ring gasket
 * over a bolt hole, …) comes from the core's `validateJointDesign`, called from a refinement so
 * every message names its field path, e.g. `bolts[3].position: bolt hole lies outside the flange outline`.
 */
import { z } from "zod";
import { multilineText, plainText } from "@/features/forms/plain-text";
import type {
  FlangeDesignInputs,
  GasketMaterial,
  JointDesign,
  Outline,
  StockedBoltMaterial,
} from "./core/design";
import { MAX_BOLT_COUNT } from "./core/design";
import { INPUT_BOUNDS, boundMessage, describeBound, type BoundName, type InputBound } from "./core/bounds";
import { MAX_STOCKED_RANGES, validateJointDesign } from "./core/validate";
import { SUGGESTION_LIMITS, type SuggestionRequest } from "./core/suggest/request";

/**
 * A number within its plausible range from the core's one bounds table (core/bounds.ts): the
 * message gives the range and the reason, and the JSON Schema publishes minimum, maximum and the
 * reason as the description.
 */
const bounded = (name: BoundName) => {
  const b: InputBound = INPUT_BOUNDS[name];
  const message = boundMessage(b);
  let n = z.number({ error: "must be a number" }).finite({ message });
  if (b.integer) n = n.int({ message });
  n = b.minExclusive ? n.gt(b.min, { message }) : n.min(b.min, { message });
  return n.max(b.max, { message }).meta({ description: `${describeBound(b)}: ${b.why}` });
};
const point = z.object({ x: bounded("planCoordinateMm"), y: bounded("planCoordinateMm") });

export const outlineSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("circle"), diameterMm: bounded("planDimensionMm") }),
  z.object({
    kind: z.literal("rectangle"),
    widthMm: bounded("planDimensionMm"),
    heightMm: bounded("planDimensionMm"),
    cornerRadiusMm: bounded("cornerRadiusMm"),
  }),
  z.object({
    kind: z.literal("obround"),
    lengthMm: bounded("planDimensionMm"),
    widthMm: bounded("planDimensionMm"),
  }),
  z.object({ kind: z.literal("polygon"), points: z.array(point).min(3).max(4096) }),
]) satisfies z.ZodType<Outline>;

export const gasketMaterialSchema = z.object({
  name: plainText().min(1).max(200),
  catalogueId: plainText().max(100).optional(),
  m: bounded("gasketFactorM"),
  yMpa: bounded("gasketStressMpa"),
  qMinMpa: bounded("gasketStressMpa").optional(),
  qsMinMpa: bounded("gasketStressMpa").optional(),
  qsMaxMpa: bounded("gasketCrushMpa").optional(),
  modulusMpa: bounded("gasketModulusMpa"),
  thicknessMm: bounded("gasketThicknessMm"),
  source: plainText().max(500),
}) satisfies z.ZodType<GasketMaterial>;

const ringGeometrySchema = z.discriminatedUnion("kind", [
  z.object({
    kind: z.literal("annulus"),
    innerDiameterMm: bounded("planDimensionMm"),
    outerDiameterMm: bounded("planDimensionMm"),
  }),
  z.object({
    kind: z.literal("band"),
    centreOffsetMm: bounded("planDimensionMm"),
    widthMm: bounded("planDimensionMm"),
  }),
]);

const gasketSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("ring"), geometry: ringGeometrySchema, material: gasketMaterialSchema }),
  z.object({ kind: z.literal("full-face"), material: gasketMaterialSchema }),
]);

const boltPathSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("circle"), diameterMm: bounded("planDimensionMm") }),
  z.object({ kind: z.literal("offset"), offsetMm: bounded("planDimensionMm") }),
]);

const boltSchema = z.object({
  id: plainText().min(1).max(40),
  sMm: z.number().finite(),
  offPathMm: z.number().finite().optional(),
});

const terminationSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("nut") }),
  z.object({
    kind: z.literal("tapped-hole"),
    engagementMm: bounded("engagementMm"),
    memberThicknessMm: bounded("tappedMemberThicknessMm"),
    memberModulusMpa: bounded("plateModulusMpa"),
  }),
]);

const positiveMpa = (what: string) =>
  z
    .number({ error: `${what} must be a number` })
    .finite()
    .gt(0, { message: `${what} must be greater than 0` });

/** A Stockroom bolting row as stored (core/design.ts `StockedBoltMaterial`): the values its own schema accepted. */
export const stockedBoltMaterialSchema = z
  .object({
    name: plainText().min(1).max(120),
    modulusMpa: positiveMpa("modulusMpa"),
    ranges: z
      .array(
        z
          .object({
            maxDiameterMm: positiveMpa("maxDiameterMm"),
            proofMpa: positiveMpa("proofMpa").nullable(),
            yieldMpa: positiveMpa("yieldMpa"),
            tensileMpa: positiveMpa("tensileMpa"),
            allowableMpa: positiveMpa("allowableMpa").nullable(),
          })
          .strict(),
      )
      .min(1, { message: "give at least one strength range" })
      .max(MAX_STOCKED_RANGES, { message: `at most ${MAX_STOCKED_RANGES} strength ranges` }),
    source: plainText().min(1).max(300),
    edition: plainText().max(200),
  })
  .strict() satisfies z.ZodType<StockedBoltMaterial>;

const fastenerSchema = z.object({
  designation: plainText().min(1).max(20),
  threadSeries: z.enum(["metric-coarse", "unified-8un", "unc"]),
  materialId: plainText().min(1).max(60),
  stockedMaterial: stockedBoltMaterialSchema.nullable().optional(),
  form: z.enum(["stud", "hex-bolt"]),
  lengthMm: bounded("boltLengthMm"),
  holeDiameterMm: bounded("holeDiameterMm"),
  washer: z
    .object({ thicknessMm: bounded("washerThicknessMm"), outerDiameterMm: bounded("washerOuterDiameterMm") })
    .nullable(),
  washerActsAs: z.enum(["rigid", "flexible"]).optional(),
  nutSeries: z.enum(["iso-4032", "iso-old"]).optional(),
  termination: terminationSchema,
  enteredAllowable: z
    .object({
      valueMpa: bounded("allowableStressMpa"),
      source: plainText().trim().min(1, { message: "name the source" }).max(300),
    })
    .nullable()
    .optional(),
});

const enteredAllowableSchema = z.object({
  designMpa: bounded("allowableStressMpa"),
  ambientMpa: bounded("allowableStressMpa"),
  source: plainText().trim().min(1, { message: "name the source" }).max(300),
});

export const flangeDesignSchema = z.object({
  kind: z.enum(["integral-hub", "integral-no-hub", "ring-loose", "not-entered"]),
  hub: z
    .object({
      g0Mm: bounded("hubThicknessMm"),
      g1Mm: bounded("hubThicknessMm"),
      hMm: bounded("hubDimensionMm"),
    })
    .nullable()
    .optional(),
  flangeMaterialId: plainText().max(60).nullable().optional(),
  coverMaterialId: plainText().max(60).nullable().optional(),
  flangeAllowable: enteredAllowableSchema.nullable().optional(),
  coverAllowable: enteredAllowableSchema.nullable().optional(),
  coverSketch: z
    .discriminatedUnion("kind", [
      z.object({ kind: z.literal("catalogue"), id: plainText().min(1).max(60) }),
      z.object({
        kind: z.literal("entered"),
        c: z.number().finite().positive().max(1),
        source: plainText().trim().min(1, { message: "name the source" }).max(300),
      }),
    ])
    .nullable()
    .optional(),
  testPressureMpa: bounded("designPressureMpa").nullable().optional(),
}) satisfies z.ZodType<FlangeDesignInputs>;

const layerSchema = z.discriminatedUnion("role", [
  z.object({ role: z.literal("gasket") }),
  z.object({
    role: z.enum(["flange", "cover"]),
    thicknessMm: bounded("plateThicknessMm"),
    materialName: plainText().max(100),
    modulusMpa: bounded("plateModulusMpa"),
  }),
]);

const preloadSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("fraction-of-proof"), value: bounded("preloadFraction") }),
  z.object({ kind: z.literal("fraction-of-yield"), value: bounded("preloadFraction") }),
  z.object({
    kind: z.literal("bolt-stress"),
    value: bounded("preloadStressMpa"),
    areaBasis: z.enum(["tensile", "root"]).optional(),
  }),
]);

export const jointDesignBaseSchema = z.object({
  schemaVersion: z.literal(1),
  name: plainText().min(1).max(200),
  description: multilineText().max(2000).optional(),
  templateId: plainText().max(100).optional(),
  units: z.enum(["SI", "US"]),
  outline: outlineSchema,
  bore: outlineSchema.nullable(),
  gasket: gasketSchema,
  boltPath: boltPathSchema,
  bolts: z
    .array(boltSchema)
    .min(1, { message: "at least one bolt is needed" })
    .max(MAX_BOLT_COUNT, { message: `at most ${MAX_BOLT_COUNT} bolts` }),
  fastener: fastenerSchema,
  layers: z.array(layerSchema).min(2).max(12),
  loads: z.object({
    designPressureMpa: bounded("designPressureMpa"),
    designTemperatureC: bounded("designTemperatureC"),
    axialLoadN: bounded("axialLoadN"),
    momentNmm: bounded("momentNmm"),
  }),
  assembly: z.object({
    preload: preloadSchema,
    nutFactor: z.object({ value: bounded("nutFactor"), source: plainText().max(300) }),
    method: z.enum([
      "torque-wrench",
      "turn-of-nut",
      "hydraulic-tensioner",
      "load-indicating-washer",
      "bolt-elongation",
      "ultrasonic",
    ]),
    scatterOverride: bounded("scatter").nullable(),
  }),
  estimator: z.object({
    coneAngle: z.discriminatedUnion("mode", [
      z.object({ mode: z.literal("thickness-dependent") }),
      z.object({ mode: z.literal("fixed"), degrees: bounded("coneAngleDeg") }),
    ]),
    estimator: z.enum(["auto", "cone", "beam"]),
    samplesPerPitch: bounded("samplesPerPitch"),
    grid: z.object({ nx: bounded("gridCells"), ny: bounded("gridCells") }),
  }),
  flangeDesign: flangeDesignSchema.optional(),
}) satisfies z.ZodType<JointDesign>;

/** Splits "bolts[3].position" into ["bolts", 3, "position"] for zod issue paths. */
function toPath(path: string): (string | number)[] {
  return path
    .split(/\.|\[|\]/)
    .filter((p) => p !== "")
    .map((p) => (/^\d+$/.test(p) ? Number(p) : p));
}

export const jointDesignSchema = jointDesignBaseSchema.superRefine((design, ctx) => {
  // A field the schema above already refused (a negative length, say) is not reported again by
  // the core's own range check: one message per field.
  const refused = new Set(ctx.issues.map((i) => (i.path ?? []).map(String).join(".")));
  for (const issue of validateJointDesign(design)) {
    const path = toPath(issue.path);
    if (refused.has(path.map(String).join("."))) continue;
    ctx.addIssue({ code: "custom", path, message: `${issue.path}: ${issue.message}` });
  }
});

export type JointDesignInput = z.input<typeof jointDesignSchema>;

/** Formats a zod error as one line per issue, each starting with the field path. */
export function formatDesignErrors(error: z.ZodError): string[] {
  return error.issues.map((i) => {
    const path = i.path.reduce<string>(
      (acc, p) => (typeof p === "number" ? `${acc}[${p}]` : acc ? `${acc}.${String(p)}` : String(p)),
      "",
    );
    return i.message.startsWith(`${path}:`) ? i.message : `${path || "(design)"}: ${i.message}`;
  });
}

const suggestionLimitsMm = INPUT_BOUNDS.planCoordinateMm.max;
const lengthMm = (what: string) =>
  z
    .number({ error: `${what} must be a number (mm)` })
    .finite({ message: `${what} must be a finite number (mm)` })
    .min(0, { message: `${what} must be at least 0 mm` })
    .max(suggestionLimitsMm, { message: `${what} must be at most ${suggestionLimitsMm} mm` });

/**
 * The pattern search's request (core/suggest/request.ts, `SuggestionRequest`): the design plus the
 * allowed sizes and materials, an optional offset range and the layout constraints. Types and
 * list lengths are checked here; what depends on the design (a size in the thread catalogue, a
 * fixed bolt that exists, a keep-out on the path) is `checkSuggestionRequest`'s, which names the
 * same paths. Unknown keys are refused, so a misspelt constraint is not silently ignored.
 */
export const suggestionRequestSchema = z
  .object({
    design: jointDesignSchema,
    sizes: z
      .array(
        z.object({
          designation: plainText().min(1).max(20),
          threadSeries: z.enum(["metric-coarse", "unified-8un", "unc"]),
        }),
      )
      .min(1, { message: "give at least one bolt size, or leave sizes out for the whole catalogue" })
      .max(SUGGESTION_LIMITS.sizes, { message: `at most ${SUGGESTION_LIMITS.sizes} bolt sizes` })
      .optional(),
    materialIds: z
      .array(plainText().min(1).max(60))
      .min(1, { message: "give at least one bolt material, or leave materialIds out for the design's" })
      .max(SUGGESTION_LIMITS.materials, { message: `at most ${SUGGESTION_LIMITS.materials} bolt materials` })
      .optional(),
    stockedBolting: z
      .array(z.object({ id: plainText().min(1).max(60), material: stockedBoltMaterialSchema }).strict())
      .max(SUGGESTION_LIMITS.stockedRows, {
        message: `at most ${SUGGESTION_LIMITS.stockedRows} Stockroom bolting rows`,
      })
      .optional(),
    units: z.enum(["SI", "US"], { error: 'must be "SI" or "US"' }).optional(),
    offsetRangeMm: z
      .object({
        fromMm: lengthMm("fromMm"),
        toMm: lengthMm("toMm"),
        stepMm: lengthMm("stepMm"),
      })
      .strict()
      .nullable()
      .optional(),
    keepOuts: z
      .array(
        z.discriminatedUnion("kind", [
          z
            .object({
              kind: z.literal("arc-length"),
              fromMm: lengthMm("fromMm"),
              toMm: lengthMm("toMm"),
              label: plainText().max(80).optional(),
            })
            .strict(),
          z
            .object({
              kind: z.literal("parameter"),
              from: z.number({ error: "must be a number from 0 to 1" }).min(0).max(1),
              to: z.number({ error: "must be a number from 0 to 1" }).min(0).max(1),
              label: plainText().max(80).optional(),
            })
            .strict(),
        ]),
      )
      .max(SUGGESTION_LIMITS.keepOuts, { message: `at most ${SUGGESTION_LIMITS.keepOuts} keep-out zones` })
      .optional(),
    fixedBoltIds: z
      .array(plainText().min(1).max(40))
      .max(MAX_BOLT_COUNT, { message: `at most ${MAX_BOLT_COUNT} fixed bolts` })
      .optional(),
    straddleCentreLines: z.boolean({ error: "must be true or false" }).optional(),
    allowLayoutWarnings: z.boolean({ error: "must be true or false" }).optional(),
    minToolClearanceMm: z
      .number({ error: "must be a number (mm)" })
      .min(0, { message: "must be at least 0 mm" })
      .max(SUGGESTION_LIMITS.toolClearanceMm, {
        message: `must be at most ${SUGGESTION_LIMITS.toolClearanceMm} mm`,
      })
      .optional(),
    maxAnalyses: z
      .number({ error: "must be a whole number" })
      .int({ message: "must be a whole number" })
      .min(1, { message: "must be at least 1" })
      .max(SUGGESTION_LIMITS.maxAnalyses, {
        message: `must be at most ${SUGGESTION_LIMITS.maxAnalyses} (the work cap of one search)`,
      })
      .optional(),
  })
  .strict() satisfies z.ZodType<SuggestionRequest>;
