import { exportCsv, importCsv } from "@/features/library/route-handlers";
import { withRequestLog } from "@/server/log/with-logging";

// Export the organisation's own gaskets rows as CSV; import a CSV (?step=preview, then ?step=commit).
async function handleGET(request: Request) {
  return exportCsv(request, "gasket");
}

async function handlePOST(request: Request) {
  return importCsv(request, "gasket");
}

export const GET = withRequestLog("/api/v1/library/gaskets/csv", handleGET);
export const POST = withRequestLog("/api/v1/library/gaskets/csv", handlePOST);
