/**
 * zod schema of the joint design document (features/analysis/core/design.ts). Types and ranges
 * are checked here; geometric validity (bolts inside the outline, overlapping holes, a ring gasket
 * over a bolt hole, …) comes from the core's `validateJointDesign`, called from a refinement so
 * every message names its field path, e.g. `bolts[3].position: bolt hole lies outside the flange outline`.
 */
import { z } from "zod";
import { multilineText, plainText } from "@/features/forms/plain-text";
import type { JointDesign } from "./core/design";
import { MAX_BOLT_COUNT } from "./core/design";
import { validateJointDesign } from "./core/validate";

const positive = (what = "must be greater than zero") => z.number().finite().positive({ message: what });
const nonNegative = () => z.number().finite().min(0, { message: "must be zero or positive" });
const point = z.object({ x: z.number().finite(), y: z.number().finite() });

export const outlineSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("circle"), diameterMm: positive() }),
  z.object({
    kind: z.literal("rectangle"),
    widthMm: positive(),
    heightMm: positive(),
    cornerRadiusMm: nonNegative(),
  }),
  z.object({ kind: z.literal("obround"), lengthMm: positive(), widthMm: positive() }),
  z.object({ kind: z.literal("polygon"), points: z.array(point).min(3).max(4096) }),
]);

export const gasketMaterialSchema = z.object({
  name: plainText().min(1).max(200),
  catalogueId: plainText().max(100).optional(),
  m: nonNegative(),
  yMpa: nonNegative(),
  qMinMpa: nonNegative().optional(),
  qsMinMpa: nonNegative().optional(),
  qsMaxMpa: positive().optional(),
  modulusMpa: positive(),
  thicknessMm: positive(),
  source: plainText().max(500),
});

const ringGeometrySchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("annulus"), innerDiameterMm: positive(), outerDiameterMm: positive() }),
  z.object({ kind: z.literal("band"), centreOffsetMm: positive(), widthMm: positive() }),
]);

const gasketSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("ring"), geometry: ringGeometrySchema, material: gasketMaterialSchema }),
  z.object({ kind: z.literal("full-face"), material: gasketMaterialSchema }),
]);

const boltPathSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("circle"), diameterMm: positive() }),
  z.object({ kind: z.literal("offset"), offsetMm: positive() }),
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
    engagementMm: positive(),
    memberThicknessMm: positive(),
    memberModulusMpa: positive(),
  }),
]);

const fastenerSchema = z.object({
  designation: plainText().min(1).max(20),
  threadSeries: z.enum(["metric-coarse", "unified-8un", "unc"]),
  materialId: plainText().min(1).max(60),
  form: z.enum(["stud", "hex-bolt"]),
  lengthMm: positive(),
  holeDiameterMm: positive(),
  washer: z.object({ thicknessMm: positive(), outerDiameterMm: positive() }).nullable(),
  nutSeries: z.enum(["iso-4032", "iso-old"]).optional(),
  termination: terminationSchema,
});

const layerSchema = z.discriminatedUnion("role", [
  z.object({ role: z.literal("gasket") }),
  z.object({
    role: z.enum(["flange", "cover"]),
    thicknessMm: positive(),
    materialName: plainText().max(100),
    modulusMpa: positive(),
  }),
]);

const preloadSchema = z.discriminatedUnion("kind", [
  z.object({ kind: z.literal("fraction-of-proof"), value: z.number().finite().positive().max(1.2) }),
  z.object({ kind: z.literal("fraction-of-yield"), value: z.number().finite().positive().max(1.2) }),
  z.object({
    kind: z.literal("bolt-stress"),
    value: positive(),
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
    designPressureMpa: nonNegative(),
    designTemperatureC: z.number().finite(),
    axialLoadN: z.number().finite(),
    momentNmm: z.number().finite(),
  }),
  assembly: z.object({
    preload: preloadSchema,
    nutFactor: z.object({ value: z.number().finite().min(0.05).max(0.5), source: plainText().max(300) }),
    method: z.enum([
      "torque-wrench",
      "turn-of-nut",
      "hydraulic-tensioner",
      "load-indicating-washer",
      "bolt-elongation",
      "ultrasonic",
    ]),
    scatterOverride: z.number().finite().min(0).max(0.9).nullable(),
  }),
  estimator: z.object({
    coneAngle: z.discriminatedUnion("mode", [
      z.object({ mode: z.literal("thickness-dependent") }),
      z.object({ mode: z.literal("fixed"), degrees: z.number().finite().min(5).max(60) }),
    ]),
    estimator: z.enum(["auto", "cone", "beam"]),
    samplesPerPitch: z.number().int().min(8).max(1024),
    grid: z.object({ nx: z.number().int().min(2).max(2048), ny: z.number().int().min(2).max(2048) }),
  }),
});

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
  for (const issue of validateJointDesign(design as JointDesign)) {
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
