import { serveShopFile } from "@/features/exports/serve-shop-file";

type Context = { params: Promise<{ designId: string; number: string }> };

// The hole list (CSV) of one stored revision, in the design's own length unit.
export async function GET(request: Request, { params }: Context) {
  return serveShopFile(request, await params, "hole-list");
}
