import { exportCsv, importCsv } from "@/features/library/route-handlers";
import { withRequestLog } from "@/server/log/with-logging";

// Export the organisation's own bolting rows as CSV; import a CSV (?step=preview, then ?step=commit).
async function handleGET(request: Request) {
  return exportCsv(request, "bolting");
}

async function handlePOST(request: Request) {
  return importCsv(request, "bolting");
}

export const GET = withRequestLog("/api/v1/library/bolting/csv", handleGET);
export const POST = withRequestLog("/api/v1/library/bolting/csv", handlePOST);
