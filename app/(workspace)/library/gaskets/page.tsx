import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { GasketTable } from "@/features/library/components/gasket-table";
import { StockroomHeader } from "@/features/library/components/stockroom-header";
import { canEditLibrary } from "@/features/library/policies";
import { listGasketChoices, listGasketListing } from "@/features/library/queries";
import { requireViewer } from "@/server/auth/guard";

export const metadata: Metadata = { title: "Stockroom · Gaskets" };

export default async function StockroomGasketsPage() {
  const viewer = await requireViewer();
  const canEdit = canEditLibrary(viewer);
  const rows = await (canEdit ? listGasketListing : listGasketChoices)(getDb(), viewer.organizationId);
  return (
    <div className="flex flex-col gap-6">
      <StockroomHeader current="/library/gaskets" canEdit={canEdit} />
      <GasketTable rows={rows} canEdit={canEdit} />
    </div>
  );
}
