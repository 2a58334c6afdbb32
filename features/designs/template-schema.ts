import { z } from "zod";
import { plainText } from "@/features/forms/plain-text";
import { INPUT_BOUNDS } from "@/features/analysis/core/bounds";
import { MAX_BOLT_COUNT, type PointMm } from "@/features/analysis/core/design";
import { validateJointDesign } from "@/features/analysis/core/validate";
import {
  buildDesignFromTemplate,
  coverBandLayout,
  pipeFlangeRow,
  type TemplateInput,
} from "./model/templates";
import { METRIC_BOLT_SIZES, metricHoleDiameterMm, nominalDiameterMm } from "./model/template-defaults";

// The new-design form: one flat object per template (so each error lands on its input). The same
// schema checks the API's `template` body. After the field rules pass, the document is built and
// run through the core's validator; what it finds is mapped back onto the field that caused it.

// The plan-size limit of the core's bounds table (core/bounds.ts), so a template can make any
// joint the document accepts.
const MAX_DIMENSION_MM = INPUT_BOUNDS.planDimensionMm.max;

/** A number from a form string or JSON; "", letters, NaN and ±∞ each get their own message. */
export function numberField(
  label: string,
  options: { unit?: string; min?: number; exclusiveMin?: boolean; max: number; integer?: boolean },
) {
  const unit = options.unit ? ` ${options.unit}` : "";
  const min = options.min ?? 0;
  let schema = z.number({
    error: (issue) => (issue.input === undefined ? `${label} is required` : `${label} must be a number`),
  });
  if (options.integer) schema = schema.int({ error: `${label} must be a whole number` });
  schema =
    options.exclusiveMin === false
      ? schema.min(min, { error: `${label} must be at least ${min}${unit}` })
      : schema.gt(min, {
          error:
            min === 0 ? `${label} must be greater than zero` : `${label} must be more than ${min}${unit}`,
        });
  schema = schema.max(options.max, { error: `${label} must be at most ${options.max}${unit}` });
  return z.preprocess((v) => {
    if (typeof v !== "string") return v;
    const t = v.trim().replace(",", ".");
    return t === "" ? undefined : Number(t);
  }, schema);
}

const length = (label: string) => numberField(label, { unit: "mm", max: MAX_DIMENSION_MM });
const boltCount = numberField("Number of bolts", {
  integer: true,
  min: 3,
  exclusiveMin: false,
  max: MAX_BOLT_COUNT,
});
const boltSize = z.enum(METRIC_BOLT_SIZES, { error: "Bolt size: choose one of the listed sizes" });

export const designNameSchema = plainText({ error: "Name is required" })
  .trim()
  .min(1, { error: "Name is required" })
  .max(120, { error: "Name must be at most 120 characters" });
export const equipmentTagSchema = plainText()
  .trim()
  .max(60, { error: "Equipment tag must be at most 60 characters" })
  .default("");

const coverFields = {
  boltEdgeDistanceMm: length("Bolt edge distance"),
  boltCount,
  boltSize,
  coverThicknessMm: length("Cover thickness"),
  flangeThicknessMm: length("Flange thickness"),
  gasketWidthMm: length("Gasket width"),
};

const coordinate = z
  .number({ error: "Vertices: each line needs two numbers, x and y" })
  .min(-MAX_DIMENSION_MM, { error: `Vertices: coordinates must be within ±${MAX_DIMENSION_MM} mm` })
  .max(MAX_DIMENSION_MM, { error: `Vertices: coordinates must be within ±${MAX_DIMENSION_MM} mm` });

/** "x, y" per line (or separated by ";"), mm. */
const pointsField = z.preprocess(
  (v) => {
    if (typeof v !== "string") return v;
    return v
      .split(/[;\n]+/)
      .map((s) => s.trim())
      .filter(Boolean)
      .map((pair) => {
        const parts = pair.split(/[\s,]+/).filter(Boolean);
        return parts.length === 2
          ? { x: Number(parts[0]), y: Number(parts[1]) }
          : { x: Number.NaN, y: Number.NaN };
      });
  },
  z
    .array(z.object({ x: coordinate, y: coordinate }), { error: 'Vertices: enter one "x, y" pair per line' })
    .min(3, { error: "Vertices: a polygon needs at least 3 points" })
    .max(200, { error: "Vertices: at most 200 points" }),
);

const roundFlangeFields = {
  outsideDiameterMm: length("Outside diameter"),
  boreDiameterMm: numberField("Bore diameter", {
    unit: "mm",
    min: 0,
    exclusiveMin: false,
    max: MAX_DIMENSION_MM,
  }),
  boltCircleDiameterMm: length("Bolt circle diameter"),
  boltCount,
  boltSize,
  flangeThicknessMm: length("Flange thickness"),
};

const shapes = [
  z.object({ kind: z.literal("full-face-flange"), ...roundFlangeFields }),
  z.object({ kind: z.literal("circular-flange"), ...roundFlangeFields }),
  z.object({
    kind: z.literal("pipe-flange"),
    flangeTemplateId: plainText({ error: "Pipe flange: choose a size" }).refine(
      (id) => pipeFlangeRow(id) !== undefined,
      {
        error: "Pipe flange: choose a size from the catalogue",
      },
    ),
    flangeThicknessMm: length("Flange thickness"),
  }),
  z.object({
    kind: z.literal("rectangular-cover"),
    widthMm: length("Width"),
    heightMm: length("Height"),
    cornerRadiusMm: numberField("Corner radius", {
      unit: "mm",
      min: 0,
      exclusiveMin: false,
      max: MAX_DIMENSION_MM,
    }),
    ...coverFields,
  }),
  z.object({
    kind: z.literal("obround-manway"),
    lengthMm: length("Length"),
    widthMm: length("Width"),
    ...coverFields,
  }),
  z.object({ kind: z.literal("polygon-cover"), points: pointsField, ...coverFields }),
] as const;

const templateShapesSchema = z.discriminatedUnion("kind", shapes, {
  error: "Template: choose one of the templates",
});

export const templateParamsSchema = templateShapesSchema.superRefine((input, ctx) => {
  // Zod runs refinements after continuable issues (e.g. a negative width); the geometry rules
  // need every field valid, so they run only on an input that passes the field rules.
  if (templateShapesSchema.safeParse(input).success) checkTemplateGeometry(input as TemplateInput, ctx);
});

export const newDesignFormSchema = z
  .object({ name: designNameSchema, equipmentTag: equipmentTagSchema })
  .and(templateParamsSchema);

export type TemplateParamsInput = z.infer<typeof templateParamsSchema>;
export type NewDesignFormInput = z.infer<typeof newDesignFormSchema>;

type Ctx = z.RefinementCtx;

function fail(ctx: Ctx, field: string, message: string): void {
  ctx.addIssue({ code: "custom", path: [field], message });
}

/** Field rules that need two numbers, then the core's validator on the built document. */
function checkTemplateGeometry(input: TemplateInput, ctx: Ctx): void {
  if (input.kind === "circular-flange" || input.kind === "full-face-flange") {
    const hole = metricHoleDiameterMm(nominalDiameterMm(input.boltSize));
    if (input.boltCircleDiameterMm + hole >= input.outsideDiameterMm)
      return fail(
        ctx,
        "boltCircleDiameterMm",
        `Bolt circle diameter must leave the Ø${hole} mm holes inside the outside diameter (at most ${input.outsideDiameterMm - hole - 1} mm)`,
      );
    if (input.kind === "full-face-flange" && input.boreDiameterMm + hole + 2 >= input.boltCircleDiameterMm)
      return fail(
        ctx,
        "boreDiameterMm",
        "Bore diameter leaves no gasket between the bore and the bolt holes",
      );
    if (input.kind === "circular-flange" && input.boreDiameterMm + 12 + hole >= input.boltCircleDiameterMm)
      return fail(ctx, "boreDiameterMm", "Bore diameter leaves no room for a gasket inside the bolt holes");
  } else if (input.kind !== "pipe-flange") {
    const { holeDiameterMm, boreOffsetMm } = coverBandLayout(input);
    if (input.boltEdgeDistanceMm <= holeDiameterMm / 2 + 1)
      return fail(
        ctx,
        "boltEdgeDistanceMm",
        `Bolt edge distance must be more than ${holeDiameterMm / 2 + 1} mm so the Ø${holeDiameterMm} mm holes stay inside the edge`,
      );
    const smallest =
      input.kind === "rectangular-cover"
        ? Math.min(input.widthMm, input.heightMm)
        : input.kind === "obround-manway"
          ? Math.min(input.lengthMm, input.widthMm)
          : Infinity;
    if (smallest / 2 <= boreOffsetMm) {
      const field =
        input.kind === "rectangular-cover"
          ? input.widthMm <= input.heightMm
            ? "widthMm"
            : "heightMm"
          : input.kind === "obround-manway" && input.lengthMm <= input.widthMm
            ? "lengthMm"
            : "widthMm";
      return fail(
        ctx,
        field,
        `Too small for this bolt edge distance and gasket width: needs more than ${Math.ceil(2 * boreOffsetMm)} mm`,
      );
    }
  }
  let issues;
  try {
    issues = validateJointDesign(
      buildDesignFromTemplate({ name: "check", equipmentTag: "", units: "SI" }, input),
    );
  } catch (error) {
    return fail(
      ctx,
      "kind",
      `This template could not be built: ${error instanceof Error ? error.message : String(error)}`,
    );
  }
  const seen = new Set<string>();
  for (const issue of issues) {
    const field = fieldForIssue(input.kind, issue.path, issue.message);
    const message = issueMessage(input.kind, issue.path, issue.message);
    if (seen.has(`${field}\n${message}`)) continue;
    seen.add(`${field}\n${message}`);
    fail(ctx, field, message);
  }
}

function fieldForIssue(kind: TemplateInput["kind"], path: string, message: string): string {
  const round = kind === "circular-flange" || kind === "pipe-flange";
  if (path.startsWith("bolts[") && message.includes("overlaps the hole")) return "boltCount";
  if (path.startsWith("bolts[") && message.includes("bore"))
    return round ? "boreDiameterMm" : "gasketWidthMm";
  if (path.startsWith("bolts[") || path.startsWith("boltPath"))
    return round ? "boltCircleDiameterMm" : "boltEdgeDistanceMm";
  if (path.startsWith("outline.points")) return "points";
  if (path.startsWith("outline"))
    return round ? "outsideDiameterMm" : kind === "polygon-cover" ? "points" : "widthMm";
  if (path.startsWith("bore") || path.startsWith("gasket.geometry.inner"))
    return round ? "boreDiameterMm" : "gasketWidthMm";
  if (path.startsWith("gasket")) return round ? "boltCircleDiameterMm" : "gasketWidthMm";
  if (path.startsWith("fastener")) return "boltSize";
  return "kind";
}

function issueMessage(kind: TemplateInput["kind"], path: string, message: string): string {
  if (path.startsWith("bolts[") && message.includes("overlaps the hole"))
    return "Number of bolts: too many for this bolt path (neighbouring holes overlap)";
  // One message per cause, not one per bolt: drop the bolt ids the core names.
  const general = message.replace(/ of bolt "[^"]*" \(bolts\[\d+\]\)/, " of a bolt");
  return path.startsWith("bolts[") ? `Bolt holes: ${general}` : `${general} (${path})`;
}

export function pointsToText(points: PointMm[]): string {
  return points.map((p) => `${p.x}, ${p.y}`).join("\n");
}
