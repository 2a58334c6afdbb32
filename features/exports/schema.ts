import { z } from "zod";

// Inputs of the export routes: the path (design id, revision number) and the sheet options.
export const exportPathSchema = z.object({
  designId: z.uuid({ error: "This design does not exist." }),
  number: z.coerce
    .number({ error: "The revision number must be a whole number." })
    .int("The revision number must be a whole number.")
    .min(1, "Revision numbers start at 1."),
});

export const sheetOptionsSchema = z.object({
  paper: z.enum(["a4", "letter"], { error: "Paper must be a4 or letter." }).default("a4"),
  units: z.enum(["SI", "US"], { error: "Units must be SI or US." }).optional(),
});

export type ExportPathInput = z.infer<typeof exportPathSchema>;
export type SheetOptionsInput = z.infer<typeof sheetOptionsSchema>;

export const jobIdSchema = z.uuid();
