import { serveShopFile } from "@/features/exports/serve-shop-file";
import { withRequestLog } from "@/server/log/with-logging";

type Context = { params: Promise<{ designId: string; number: string }> };

// The Bolting kit (CSV) of one stored revision: studs with the length to order, nuts, washers, counts.
async function handleGET(request: Request, { params }: Context) {
  return serveShopFile(request, await params, "bolting-kit");
}

export const GET = withRequestLog("/api/v1/designs/[designId]/revisions/[number]/bolting-kit.csv", handleGET);
