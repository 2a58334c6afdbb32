import { serveShopFile } from "@/features/exports/serve-shop-file";
import { withRequestLog } from "@/server/log/with-logging";

type Context = { params: Promise<{ designId: string; number: string }> };

// The hole list (CSV) of one stored revision, in the design's own length unit.
async function handleGET(request: Request, { params }: Context) {
  return serveShopFile(request, await params, "hole-list");
}

export const GET = withRequestLog("/api/v1/designs/[designId]/revisions/[number]/holes.csv", handleGET);
