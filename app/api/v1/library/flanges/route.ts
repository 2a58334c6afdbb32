import { getChoices } from "@/features/library/route-handlers";
import { withRequestLog } from "@/server/log/with-logging";

// The organisation's flanges for pickers: built-in rows minus hidden ones, plus its own rows.
async function handleGET(request: Request) {
  return getChoices(request, "flange");
}

export const GET = withRequestLog("/api/v1/library/flanges", handleGET);
