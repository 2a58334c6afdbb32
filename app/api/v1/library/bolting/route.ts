import { getChoices } from "@/features/library/route-handlers";
import { withRequestLog } from "@/server/log/with-logging";

// The organisation's bolting for pickers: built-in rows minus hidden ones, plus its own rows.
async function handleGET(request: Request) {
  return getChoices(request, "bolting");
}

export const GET = withRequestLog("/api/v1/library/bolting", handleGET);
