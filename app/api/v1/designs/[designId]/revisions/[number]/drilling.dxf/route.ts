import { serveShopFile } from "@/features/exports/serve-shop-file";

type Context = { params: Promise<{ designId: string; number: string }> };

// The drilling template (DXF) of one stored revision, in the design's length unit ($INSUNITS set).
export async function GET(request: Request, { params }: Context) {
  return serveShopFile(request, await params, "drilling-template");
}
