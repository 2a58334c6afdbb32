import "server-only";
import type { Kysely } from "kysely";
import { z } from "zod";
import type { UnitSystem } from "@/features/analysis/core/design";
import { createDesign } from "@/features/designs/mutations";
import type { Database } from "@/db/types";
import type { ActionResult } from "@/features/forms/action-result";
import { prepareImport } from "./model/prepare-import";
import { MAX_IMPORT_FILE_BYTES, importDesignSchema } from "./schema";

// Creates a new design from a DXF (and optionally a CSV of bolt positions). The server parses the
// files itself: the browser's preview is a courtesy, never the source of the stored geometry. A
// refused file writes nothing.
export interface ImportFiles {
  fields: Record<string, unknown>;
  dxf: Uint8Array | null;
  csv: Uint8Array | null;
}

export async function fileBytes(
  value: FormDataEntryValue | null,
  label: string,
): Promise<{ bytes: Uint8Array | null; error?: string }> {
  if (!(value instanceof File) || value.size === 0) return { bytes: null };
  if (value.size > MAX_IMPORT_FILE_BYTES)
    return { bytes: null, error: `The ${label} file is larger than 1.9 MB.` };
  return { bytes: new Uint8Array(await value.arrayBuffer()) };
}

export async function createDesignFromFiles(
  db: Kysely<Database>,
  viewer: { organizationId: string; userId: string; unitSystem: UnitSystem },
  files: ImportFiles,
): Promise<ActionResult<{ designId: string }>> {
  const parsed = importDesignSchema.safeParse(files.fields);
  if (!parsed.success)
    return {
      ok: false,
      message: "Check the highlighted fields.",
      fieldErrors: z.flattenError(parsed.error).fieldErrors as Record<string, string[]>,
    };
  if (!files.dxf)
    return { ok: false, message: "Choose a DXF drawing.", fieldErrors: { dxf: ["Choose a DXF drawing."] } };
  const prepared = prepareImport({
    // DXF geometry is ASCII; text entities in another code page do not matter here.
    dxfText: new TextDecoder().decode(files.dxf),
    csv: files.csv,
    csvUnit: parsed.data.csvUnit,
    layersOn: parsed.data.layersOn,
    dxfUnit: parsed.data.dxfUnit,
    name: parsed.data.name,
    units: viewer.unitSystem,
    equipmentTag: parsed.data.equipmentTag,
  });
  if (!prepared.ok)
    return { ok: false, message: prepared.message, fieldErrors: { [prepared.field]: [prepared.message] } };
  const { designId } = await createDesign(db, {
    organizationId: viewer.organizationId,
    ownerId: viewer.userId,
    name: parsed.data.name,
    equipmentTag: parsed.data.equipmentTag,
    document: prepared.built.design,
  });
  return { ok: true, data: { designId } };
}
