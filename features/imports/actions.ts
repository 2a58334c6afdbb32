"use server";

import { redirect } from "next/navigation";
import { getDb } from "@/db/index";
import type { ActionResult } from "@/features/forms/action-result";
import { requireViewer } from "@/server/auth/guard";
import { createDesignFromFiles, fileBytes } from "./mutations";
import { loggedAction } from "@/server/log/with-logging";

// The Drawing intake's "Create design": files and fields from the form, parsed again on the server.
async function importDesignActionImpl(
  _prev: ActionResult<{ designId: string }> | null,
  formData: FormData,
): Promise<ActionResult<{ designId: string }>> {
  const viewer = await requireViewer();
  if (!viewer.roles.includes("designer")) return { ok: false, message: "Only designers can create designs." };
  const dxf = await fileBytes(formData.get("dxf"), "DXF");
  const csv = await fileBytes(formData.get("csv"), "CSV");
  if (dxf.error) return { ok: false, message: dxf.error, fieldErrors: { dxf: [dxf.error] } };
  if (csv.error) return { ok: false, message: csv.error, fieldErrors: { csv: [csv.error] } };
  const result = await createDesignFromFiles(getDb(), viewer, {
    fields: {
      name: formData.get("name") ?? "",
      equipmentTag: formData.get("equipmentTag") ?? "",
      csvUnit: formData.get("csvUnit") ?? "mm",
      dxfUnit: formData.get("dxfUnit") || undefined,
      layersOn: formData.get("layersOn") || undefined,
    },
    dxf: dxf.bytes,
    csv: csv.bytes,
  });
  if (!result.ok) return result;
  redirect(`/designs/${result.data.designId}`);
}

export const importDesignAction = loggedAction("imports.importDesign", importDesignActionImpl);
