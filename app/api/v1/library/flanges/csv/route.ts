import { exportCsv, importCsv } from "@/features/library/route-handlers";
import { withRequestLog } from "@/server/log/with-logging";

// Export the organisation's own flanges rows as CSV; import a CSV (?step=preview, then ?step=commit).
async function handleGET(request: Request) {
  return exportCsv(request, "flange");
}

async function handlePOST(request: Request) {
  return importCsv(request, "flange");
}

export const GET = withRequestLog("/api/v1/library/flanges/csv", handleGET);
export const POST = withRequestLog("/api/v1/library/flanges/csv", handlePOST);
