"use server";

import { redirect } from "next/navigation";
import { z } from "zod";
import { getDb } from "@/db/index";
import { createDesign } from "@/features/designs/mutations";
import type { ActionResult } from "@/features/forms/action-result";
import { requireViewer } from "@/server/auth/guard";
import { prepareImport } from "./model/prepare-import";
import { MAX_IMPORT_FILE_BYTES, importDesignSchema } from "./schema";
import { loggedAction } from "@/server/log/with-logging";

// Creates a new design from a DXF (and optionally a CSV of bolt positions). The server parses the
// files itself: the browser's preview is a courtesy, never the source of the stored geometry.
async function fileText(
  value: FormDataEntryValue | null,
  label: string,
): Promise<{ text: string | null; error?: string }> {
  if (!(value instanceof File) || value.size === 0) return { text: null };
  if (value.size > MAX_IMPORT_FILE_BYTES)
    return { text: null, error: `The ${label} file is larger than 1.9 MB.` };
  return { text: await value.text() };
}

async function importDesignActionImpl(
  _prev: ActionResult<{ designId: string }> | null,
  formData: FormData,
): Promise<ActionResult<{ designId: string }>> {
  const viewer = await requireViewer();
  if (!viewer.roles.includes("designer")) return { ok: false, message: "Only designers can create designs." };
  const parsed = importDesignSchema.safeParse({
    name: formData.get("name") ?? "",
    equipmentTag: formData.get("equipmentTag") ?? "",
    csvUnit: formData.get("csvUnit") ?? "mm",
  });
  if (!parsed.success)
    return {
      ok: false,
      message: "Check the highlighted fields.",
      fieldErrors: z.flattenError(parsed.error).fieldErrors as Record<string, string[]>,
    };
  const dxf = await fileText(formData.get("dxf"), "DXF");
  const csv = await fileText(formData.get("csv"), "CSV");
  if (dxf.error || !dxf.text)
    return {
      ok: false,
      message: dxf.error ?? "Choose a DXF drawing.",
      fieldErrors: { dxf: [dxf.error ?? "Choose a DXF drawing."] },
    };
  if (csv.error) return { ok: false, message: csv.error, fieldErrors: { csv: [csv.error] } };
  const prepared = prepareImport({
    dxfText: dxf.text,
    csvText: csv.text,
    csvUnit: parsed.data.csvUnit,
    name: parsed.data.name,
    units: viewer.unitSystem,
    equipmentTag: parsed.data.equipmentTag,
  });
  if (!prepared.ok)
    return { ok: false, message: prepared.message, fieldErrors: { [prepared.field]: [prepared.message] } };
  const { designId } = await createDesign(getDb(), {
    organizationId: viewer.organizationId,
    ownerId: viewer.userId,
    name: parsed.data.name,
    equipmentTag: parsed.data.equipmentTag,
    document: prepared.built.design,
  });
  redirect(`/designs/${designId}`);
}

export const importDesignAction = loggedAction("imports.importDesign", importDesignActionImpl);
