import { getDb } from "@/db/index";
import { getHealth } from "@/features/health/queries";

export const dynamic = "force-dynamic";

export async function GET(): Promise<Response> {
  try {
    const report = await getHealth(getDb());
    return Response.json(report, { status: report.ok ? 200 : 503, headers: { "cache-control": "no-store" } });
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    return Response.json({ ok: false, reason }, { status: 503, headers: { "cache-control": "no-store" } });
  }
}
