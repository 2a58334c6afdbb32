import { serveShopFile } from "@/features/exports/serve-shop-file";
import { withRequestLog } from "@/server/log/with-logging";

type Context = { params: Promise<{ designId: string; number: string }> };

// The drilling template (DXF) of one stored revision, in the design's length unit ($INSUNITS set).
async function handleGET(request: Request, { params }: Context) {
  return serveShopFile(request, await params, "drilling-template");
}

export const GET = withRequestLog("/api/v1/designs/[designId]/revisions/[number]/drilling.dxf", handleGET);
