import { exportCsv, importCsv } from "@/features/library/route-handlers";

// Export the organisation's own flanges rows as CSV; import a CSV (?step=preview, then ?step=commit).
export function GET(request: Request) {
  return exportCsv(request, "flange");
}

export function POST(request: Request) {
  return importCsv(request, "flange");
}
