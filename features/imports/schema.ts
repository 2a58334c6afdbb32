import { z } from "zod";
import { plainText } from "@/features/forms/plain-text";

// The import form's fields besides the files themselves.
export const importDesignSchema = z.object({
  name: plainText().trim().min(1, "Give the design a name.").max(120, "At most 120 characters."),
  equipmentTag: plainText().trim().max(60, "At most 60 characters.").optional().default(""),
  csvUnit: z.enum(["mm", "in"]).default("mm"),
  /** The unit of a DXF that states none, as switched on the Drawing intake. */
  dxfUnit: z.enum(["mm", "in"]).optional(),
  /** The layers switched on, as a JSON array of names; absent: the default layers. */
  layersOn: plainText()
    .max(200_000)
    .optional()
    .transform((v, ctx) => {
      if (!v) return undefined;
      try {
        const parsed: unknown = JSON.parse(v);
        if (Array.isArray(parsed) && parsed.every((x) => typeof x === "string")) return parsed as string[];
      } catch {
        // fall through
      }
      ctx.addIssue({ code: "custom", message: "The layer choice could not be read." });
      return z.NEVER;
    }),
});

/** Files are read whole by the server action (Next limits action bodies to 2 MB, see next.config.ts). */
export const MAX_IMPORT_FILE_BYTES = 1.9 * 1024 * 1024;
