import { z } from "zod";
import { plainText } from "@/features/forms/plain-text";

// The import form's fields besides the files themselves.
export const importDesignSchema = z.object({
  name: plainText().trim().min(1, "Give the design a name.").max(120, "At most 120 characters."),
  equipmentTag: plainText().trim().max(60, "At most 60 characters.").optional().default(""),
  csvUnit: z.enum(["mm", "in"]).default("mm"),
});

/** Files are read whole by the server action (Next limits action bodies to 2 MB, see next.config.mjs). */
export const MAX_IMPORT_FILE_BYTES = 1.9 * 1024 * 1024;
