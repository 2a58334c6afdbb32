"use client";
import { useEffect, useMemo, useState } from "react";
import type { JointDesign } from "@/features/analysis/core/design";

type Schema = (typeof import("@/features/analysis/schema"))["jointDesignSchema"];

// zod and the schema are a quarter of the Layout desk's first-load JavaScript: they are fetched
// after the page shows (one request per page load, shared by every caller). Until they arrive the
// document counts as valid here; the server action validates with the same schema on every save.
let schemaLoad: Promise<Schema> | null = null;
const loadSchema = () =>
  (schemaLoad ??= import("@/features/analysis/schema").then((m) => m.jointDesignSchema));

function useSchema(wanted: boolean): Schema | null {
  const [schema, setSchema] = useState<Schema | null>(null);
  useEffect(() => {
    if (!wanted || schema) return;
    let live = true;
    void loadSchema().then((s) => live && setSchema(() => s));
    return () => {
      live = false;
    };
  }, [wanted, schema]);
  return schema;
}

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
  const schema = useSchema(!skip);
  const schemaErrors = useMemo(() => {
    if (skip || !schema) return null;
    const r = schema.safeParse(design);
    if (r.success) return {};
    const out: Record<string, string> = {};
    for (const i of r.error.issues) {
      const path = normalisePath(i.path.map(String).join("."));
      out[path] ??= i.message.replace(/^[^:]+: /, "");
    }
    return out;
  }, [design, skip, schema]);
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
