import { z } from "zod";
import { jointDesignSchema } from "@/features/analysis/schema";
import { INPUT_BOUNDS } from "@/features/analysis/core/bounds";

// The design document as accepted by saves, creates and the stateless analysis endpoint: the
// core's schema (types, ranges and its geometric validator) plus the plan limit of the bounds
// table on every length (named …Mm), including those the schema leaves open (a bolt's arc
// position and its offset from the path): anything beyond 100 m is a typo.
const MAX_LENGTH_MM = INPUT_BOUNDS.planCoordinateMm.max;

function findAbsurdLengths(value: unknown, path: (string | number)[], out: (string | number)[][]): void {
  if (Array.isArray(value)) value.forEach((v, i) => findAbsurdLengths(v, [...path, i], out));
  else if (value && typeof value === "object") {
    for (const [key, v] of Object.entries(value)) {
      if (typeof v === "number" && key.endsWith("Mm") && Math.abs(v) > MAX_LENGTH_MM)
        out.push([...path, key]);
      else findAbsurdLengths(v, [...path, key], out);
    }
  }
}

export const designDocumentSchema = z
  .unknown()
  .superRefine((doc, ctx) => {
    const absurd: (string | number)[][] = [];
    findAbsurdLengths(doc, [], absurd);
    for (const path of absurd)
      ctx.addIssue({ code: "custom", message: `must be at most ${MAX_LENGTH_MM} mm`, path });
  })
  .pipe(jointDesignSchema);
