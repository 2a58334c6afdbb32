"use client";
import { useMemo } from "react";
import type { JointDesign } from "@/features/analysis/core/design";
import { jointDesignSchema } from "@/features/analysis/schema";

/** "layers[0].thicknessMm" and "document.layers.0.thicknessMm" both become "layers.0.thicknessMm". */
export function normalisePath(p: string): string {
  return p
    .replace(/\[(\d+)\]/g, ".$1")
    .replace(/^document\./, "")
    .replace(/^\./, "");
}

/**
 * The shared zod schema over the whole document (the same one the server action uses), as
 * messages by field path; skipped while dragging (the readout shows the core's own issues then).
 */
export function useDocumentErrors(
  design: JointDesign,
  skip: boolean,
  serverErrors: Record<string, string[]> | null,
) {
  const schemaErrors = useMemo(() => {
    if (skip) return null;
    const r = jointDesignSchema.safeParse(design);
    if (r.success) return {};
    const out: Record<string, string> = {};
    for (const i of r.error.issues) {
      const path = normalisePath(i.path.map(String).join("."));
      out[path] ??= i.message.replace(/^[^:]+: /, "");
    }
    return out;
  }, [design, skip]);
  const server = useMemo(() => {
    const out: Record<string, string> = {};
    for (const [k, v] of Object.entries(serverErrors ?? {})) if (v[0]) out[normalisePath(k)] = v[0];
    return out;
  }, [serverErrors]);
  // One object per change of its inputs, so components handed `errorFor` can be memoised.
  return useMemo(() => {
    const errorFor = (path: string) => schemaErrors?.[path] ?? server[path];
    const count = schemaErrors ? Object.keys(schemaErrors).length : 0;
    return {
      errorFor,
      schemaErrorCount: count,
      schemaMessages: schemaErrors ? Object.entries(schemaErrors).map(([k, v]) => `${k}: ${v}`) : [],
    };
  }, [schemaErrors, server]);
}
