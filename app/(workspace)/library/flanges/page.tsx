import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { FlangeTable } from "@/features/library/components/flange-table";
import { StockroomHeader } from "@/features/library/components/stockroom-header";
import { canEditLibrary } from "@/features/library/policies";
import { listFlangeTemplateChoices, listFlangeTemplateListing } from "@/features/library/queries";
import { requireViewer } from "@/server/auth/guard";

export const metadata: Metadata = { title: "Stockroom · Flange templates" };

export default async function StockroomFlangesPage() {
  const viewer = await requireViewer();
  const canEdit = canEditLibrary(viewer);
  const rows = await (canEdit ? listFlangeTemplateListing : listFlangeTemplateChoices)(
    getDb(),
    viewer.organizationId,
  );
  return (
    <div className="flex flex-col gap-6">
      <StockroomHeader current="/library/flanges" canEdit={canEdit} />
      <FlangeTable rows={rows} canEdit={canEdit} />
    </div>
  );
}
