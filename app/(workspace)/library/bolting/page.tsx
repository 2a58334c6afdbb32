import type { Metadata } from "next";
import { getDb } from "@/db/index";
import { BoltingTable } from "@/features/library/components/bolting-table";
import { StockroomHeader } from "@/features/library/components/stockroom-header";
import { canEditLibrary } from "@/features/library/policies";
import { listBoltingChoices, listBoltingListing } from "@/features/library/queries";
import { requireViewer } from "@/server/auth/guard";

export const metadata: Metadata = { title: "Stockroom · Bolting" };

export default async function StockroomBoltingPage() {
  const viewer = await requireViewer();
  const canEdit = canEditLibrary(viewer);
  const rows = await (canEdit ? listBoltingListing : listBoltingChoices)(getDb(), viewer.organizationId);
  return (
    <div className="flex flex-col gap-6">
      <StockroomHeader current="/library/bolting" canEdit={canEdit} />
      <BoltingTable rows={rows} canEdit={canEdit} />
    </div>
  );
}
