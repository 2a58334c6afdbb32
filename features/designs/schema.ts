import { z } from "zod";
import { plainText } from "@/features/forms/plain-text";
import { suggestionRequestSchema } from "@/features/analysis/schema";
import { designDocumentSchema } from "./document-schema";
import { designNameSchema, equipmentTagSchema, templateParamsSchema } from "./template-schema";

// Inputs of the designs feature: the register's search parameters, saves, and the API bodies.
// The new-design form's schema lives in template-schema.ts (one flat object per template).

export const REVISION_STATUSES = ["draft", "in_review", "returned", "approved"] as const;
export const OUTLINE_KINDS = ["circle", "rectangle", "obround", "polygon"] as const;
export const DESIGN_SORTS = ["name", "updated", "status"] as const;
/** "Updated since" choices of the register, in days. */
export const UPDATED_WITHIN_DAYS = ["1", "7", "30", "365"] as const;
export const DESIGNS_PAGE_SIZE = 25;

const uuid = z.uuid({ error: "Must be an id" });

/** Unknown or empty search parameters fall back to the default instead of failing the page. */
function lenient<T extends z.ZodType>(schema: T) {
  return z.preprocess((v) => (v === "" || v === null ? undefined : v), schema.optional().catch(undefined));
}

export const listDesignsQuerySchema = z.object({
  q: lenient(plainText().trim().max(120)),
  status: lenient(z.enum(REVISION_STATUSES)),
  owner: lenient(uuid),
  outline: lenient(z.enum(OUTLINE_KINDS)),
  updatedWithinDays: lenient(z.enum(UPDATED_WITHIN_DAYS)),
  sort: z.enum(DESIGN_SORTS).catch("updated").default("updated"),
  dir: z.enum(["asc", "desc"]).optional().catch(undefined),
  page: z.coerce.number().int().min(1).max(10_000).catch(1).default(1),
  archived: z.enum(["hide", "only"]).catch("hide").default("hide"),
});
export type ListDesignsQueryInput = z.infer<typeof listDesignsQuerySchema>;

/** URLSearchParams or Next's searchParams object → plain object for the schema. */
export function searchParamsToObject(
  params: URLSearchParams | Record<string, string | string[] | undefined>,
): Record<string, string> {
  const out: Record<string, string> = {};
  const entries = params instanceof URLSearchParams ? [...params.entries()] : Object.entries(params);
  for (const [key, value] of entries) {
    const first = Array.isArray(value) ? value[0] : value;
    if (typeof first === "string") out[key] = first;
  }
  return out;
}

export const saveWorkingRevisionSchema = z.object({
  designId: uuid,
  baseVersion: z
    .number({ error: "baseVersion must be a number" })
    .int()
    .min(1, { error: "baseVersion must be at least 1" }),
  document: designDocumentSchema,
  name: designNameSchema.optional(),
  equipmentTag: plainText()
    .trim()
    .max(60, { error: "Equipment tag must be at most 60 characters" })
    .optional(),
  /** "pattern applied from suggestion 2 of 7" in the design activity (the Layout desk's Pattern finder). */
  patternOrigin: z
    .object({
      suggestion: z.number().int().min(1).max(1000),
      of: z.number().int().min(1).max(1000),
    })
    .refine((o) => o.suggestion <= o.of, { error: "suggestion must not exceed the number of suggestions" })
    .optional(),
});
export type SaveWorkingRevisionSchemaInput = z.infer<typeof saveWorkingRevisionSchema>;

/** POST /api/v1/designs: from a template, or from a whole document. */
export const createDesignApiSchema = z
  .object({
    name: designNameSchema,
    equipmentTag: equipmentTagSchema,
    template: templateParamsSchema.optional(),
    document: designDocumentSchema.optional(),
  })
  .refine((v) => (v.template === undefined) !== (v.document === undefined), {
    error: "Send exactly one of `template` or `document`",
    path: ["template"],
  });
export type CreateDesignApiInput = z.infer<typeof createDesignApiSchema>;

/** PUT /api/v1/designs/[id]. */
export const updateDesignApiSchema = saveWorkingRevisionSchema.omit({ designId: true });

export const analysisRequestSchema = z.object({ document: designDocumentSchema });

export const unitSystemSchema = z.enum(["SI", "US"], { error: "Unit system must be SI or US" });

export const designIdSchema = uuid;

/**
 * POST /api/v1/suggestions: the pattern search's request, its design held to the saved document's
 * limits. Stockroom bolting rows are named in `materialIds` by their Stockroom id ("org:<uuid>",
 * or "builtin:<catalogue id>"); the server reads their values from the caller's organisation, so
 * the body cannot carry `stockedBolting` itself.
 */
export const suggestionApiSchema = suggestionRequestSchema
  .omit({ stockedBolting: true })
  .extend({ design: designDocumentSchema })
  .strict();
