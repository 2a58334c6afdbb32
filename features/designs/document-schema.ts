import { z } from "zod";
import type { JointDesign } from "@/features/analysis/core/design";
import { validateJointDesign } from "@/features/analysis/core/validate";

// The design document as accepted by saves, creates and the stateless analysis endpoint.
// features/analysis/schema.ts (`jointDesignSchema`, the core's own) is not in the tree yet; until
// it is, the core's validator is the authority and this adds a shape guard and a size bound.
// TODO(designs): switch to jointDesignSchema when the core publishes it.

/** Lengths are named …Mm in the document; anything beyond 100 m is a typo, not a flange. */
const MAX_LENGTH_MM = 100_000;

function pathSegments(path: string): (string | number)[] {
  return path.split(/[.[\]]+/).filter(Boolean).map((s) => (/^\d+$/.test(s) ? Number(s) : s));
}

function findAbsurdLengths(value: unknown, path: (string | number)[], out: (string | number)[][]): void {
  if (Array.isArray(value)) value.forEach((v, i) => findAbsurdLengths(v, [...path, i], out));
  else if (value && typeof value === "object") {
    for (const [key, v] of Object.entries(value)) {
      if (typeof v === "number" && key.endsWith("Mm") && Math.abs(v) > MAX_LENGTH_MM) out.push([...path, key]);
      else findAbsurdLengths(v, [...path, key], out);
    }
  }
}

export const designDocumentSchema = z
  .custom<JointDesign>((v) => typeof v === "object" && v !== null && !Array.isArray(v), { error: "Must be a design document (a JSON object)" })
  .superRefine((doc, ctx) => {
    const absurd: (string | number)[][] = [];
    findAbsurdLengths(doc, [], absurd);
    for (const path of absurd) ctx.addIssue({ code: "custom", message: `must be at most ${MAX_LENGTH_MM} mm`, path });
    if (absurd.length > 0) return;
    let issues;
    try {
      issues = validateJointDesign(doc);
    } catch {
      ctx.addIssue({ code: "custom", message: "is not a complete design document (see GET /api/v1/schema/design)" });
      return;
    }
    for (const issue of issues) ctx.addIssue({ code: "custom", message: issue.message, path: pathSegments(issue.path) });
  });
