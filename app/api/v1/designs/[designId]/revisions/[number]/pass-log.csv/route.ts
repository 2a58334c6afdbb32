import { serveShopFile } from "@/features/exports/serve-shop-file";
import { withRequestLog } from "@/server/log/with-logging";

type Context = { params: Promise<{ designId: string; number: string }> };

// The Pass log (CSV) of one stored revision: one row per pass and bolt, the target, empty cells for the value read, initials and date.
async function handleGET(request: Request, { params }: Context) {
  return serveShopFile(request, await params, "pass-log");
}

export const GET = withRequestLog("/api/v1/designs/[designId]/revisions/[number]/pass-log.csv", handleGET);
