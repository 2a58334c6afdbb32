import { exportCsv, importCsv } from "@/features/library/route-handlers";

// Export the organisation's own bolting rows as CSV; import a CSV (?step=preview, then ?step=commit).
export function GET(request: Request) {
  return exportCsv(request, "bolting");
}

export function POST(request: Request) {
  return importCsv(request, "bolting");
}
