// Input schemas of Stockroom rows, shared by the add form, the server action and the CSV import.
// Every schema reads flat string fields (FormData and CSV cells) and produces numbers in the
// core's units (mm, MPa). Field names are the CSV column names, so an error names the column.
import { z } from "zod";
import {
  INPUT_BOUNDS,
  describeBound,
  type BoundName,
  type InputBound,
} from "@/features/analysis/core/bounds";
import { MAX_BOLT_COUNT } from "@/features/analysis/core/design";
import { plainText } from "@/features/forms/plain-text";

const text = (max: number) =>
  plainText({ error: "is required" })
    .trim()
    .min(1, "is required")
    .max(max, `must be at most ${max} characters`);
const optionalText = (max: number) =>
  plainText().trim().max(max, `must be at most ${max} characters`).optional().default("");

function toNumber(v: unknown): unknown {
  if (typeof v === "string") {
    const t = v.trim();
    return t === "" ? undefined : Number(t);
  }
  return v;
}

const number = (check: (n: z.ZodNumber) => z.ZodNumber) =>
  z.preprocess(
    toNumber,
    check(z.number({ error: (i) => (i.input === undefined ? "is required" : "must be a number") })),
  );
const optionalNumber = (check: (n: z.ZodNumber) => z.ZodNumber) =>
  z.preprocess((v) => toNumber(v) ?? null, check(z.number({ error: "must be a number" })).nullable());

const positive = (n: z.ZodNumber) => n.gt(0, "must be greater than 0");
/** The plausible range of a design input (core/bounds.ts), so a Stockroom row copied into a design passes its schema. */
const inRange = (name: BoundName) => (n: z.ZodNumber) => {
  const b: InputBound = INPUT_BOUNDS[name];
  const message = `must be ${describeBound(b)}`;
  return (b.minExclusive ? n.gt(b.min, message) : n.min(b.min, message)).max(b.max, message);
};

export const gasketInputSchema = z.object({
  name: text(120),
  gasket_type: text(60),
  m: number(inRange("gasketFactorM")),
  y_mpa: number(inRange("gasketStressMpa")),
  qmin_l1: optionalNumber((n) => positive(inRange("gasketStressMpa")(n))),
  qsmin_l1: optionalNumber((n) => positive(inRange("gasketStressMpa")(n))),
  qmin_l01: optionalNumber((n) => positive(inRange("gasketStressMpa")(n))),
  qsmin_l01: optionalNumber((n) => positive(inRange("gasketStressMpa")(n))),
  qmin_l001: optionalNumber((n) => positive(inRange("gasketStressMpa")(n))),
  qsmin_l001: optionalNumber((n) => positive(inRange("gasketStressMpa")(n))),
  qsmax_mpa: optionalNumber(inRange("gasketCrushMpa")),
  pqr: optionalNumber((n) => n.gt(0, "must be greater than 0").max(1, "must be at most 1")),
  eg_mpa: optionalNumber(inRange("gasketModulusMpa")),
  modulus_mpa: number(inRange("gasketModulusMpa")),
  thickness_mm: number(inRange("gasketThicknessMm")),
  source: text(300),
  edition: optionalText(200),
});
export type GasketInput = z.output<typeof gasketInputSchema>;

export const boltingInputSchema = z
  .object({
    name: text(120),
    modulus_mpa: number(positive),
    max_diameter_mm: number(positive),
    proof_mpa: optionalNumber(positive),
    yield_mpa: number(positive),
    tensile_mpa: number(positive),
    allowable_mpa: optionalNumber(inRange("allowableStressMpa")),
    source: text(300),
    edition: optionalText(200),
  })
  .refine((r) => r.tensile_mpa >= r.yield_mpa, {
    path: ["tensile_mpa"],
    message: "must not be below the yield strength",
  });
export type BoltingInput = z.output<typeof boltingInputSchema>;

export const flangeInputSchema = z
  .object({
    standard: text(80),
    pressure_class: text(40),
    size: text(40),
    outside_diameter_mm: number(inRange("planDimensionMm")),
    bore_diameter_mm: optionalNumber(inRange("planDimensionMm")),
    bolt_circle_diameter_mm: number(inRange("planDimensionMm")),
    bolt_count: number((n) =>
      n
        .int("must be a whole number")
        .min(2, "must be at least 2")
        .max(MAX_BOLT_COUNT, `must be at most ${MAX_BOLT_COUNT}`),
    ),
    bolt_designation: text(20),
    bolt_diameter_mm: number(positive),
    hole_diameter_mm: number(inRange("holeDiameterMm")),
    source: text(300),
    edition: optionalText(200),
  })
  .refine((r) => r.bolt_circle_diameter_mm < r.outside_diameter_mm, {
    path: ["bolt_circle_diameter_mm"],
    message: "must be smaller than the outside diameter",
  })
  .refine((r) => r.hole_diameter_mm >= r.bolt_diameter_mm, {
    path: ["hole_diameter_mm"],
    message: "must not be smaller than the bolt",
  })
  .refine(
    (r) => r.bore_diameter_mm === null || r.bore_diameter_mm < r.bolt_circle_diameter_mm - r.hole_diameter_mm,
    {
      path: ["bore_diameter_mm"],
      message: "must leave room inside the bolt holes",
    },
  );
export type FlangeInput = z.output<typeof flangeInputSchema>;

export const libraryKindSchema = z.enum(["gasket", "bolting", "flange"]);

export const hideBuiltinSchema = z.object({
  kind: libraryKindSchema,
  builtinId: plainText().min(1).max(120),
  hidden: z.enum(["true", "false"]).transform((v) => v === "true"),
});

export const deleteRowSchema = z.object({ kind: libraryKindSchema, id: z.uuid("is not a row id") });
