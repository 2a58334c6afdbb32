import { servePdfExport } from "@/features/exports/sheet-request";
import { renderPassLogSheet } from "@/features/exports/sheet/render-sheet";
import { withRequestLog } from "@/server/log/with-logging";

type Context = { params: Promise<{ designId: string; number: string }> };

// The Pass log of one stored revision as a PDF of its own (?paper=a4|letter&units=SI|US), rendered
// in the request whatever the bolt count (a few pages). Any member of the organisation may export.
async function handleGET(request: Request, { params }: Context) {
  return servePdfExport(request, params, "pass-log-sheet", renderPassLogSheet);
}

export const GET = withRequestLog("/api/v1/designs/[designId]/revisions/[number]/pass-log.pdf", handleGET);
