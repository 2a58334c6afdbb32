import "server-only";
import { getDb } from "@/db/index";
import type { LibraryKind } from "@/db/tables/library";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { readBodyWithLimit } from "@/server/http/request-body";
import { KIND_LABELS } from "./model/csv-columns";
import { boltingToCsv, flangesToCsv, gasketsToCsv, parseLibraryCsv } from "./model/library-csv";
import { importLibraryCsv } from "./mutations";
import {
  listBoltingChoices,
  listFlangeTemplateChoices,
  listGasketChoices,
  listOwnBolting,
  listOwnFlangeTemplates,
  listOwnGaskets,
} from "./queries";

// The /api/v1/library/* handlers, shared by the three kinds. GET …/<kind>: the picker list
// (built-in − hidden + own) for any member; GET …/<kind>/csv: the organisation's own rows as CSV
// (the import format); POST …/<kind>/csv?step=preview|commit: admin-only import of a text/csv body.
const MAX_CSV_BYTES = 2 * 1024 * 1024;

const CHOICES = {
  gasket: listGasketChoices,
  bolting: listBoltingChoices,
  flange: listFlangeTemplateChoices,
} as const;

export async function getChoices(request: Request, kind: LibraryKind): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const rows = await CHOICES[kind](getDb(), auth.viewer.organizationId);
  return Response.json({ rows }, { headers: { "cache-control": "private, no-store" } });
}

export async function exportCsv(request: Request, kind: LibraryKind): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const db = getDb();
  const org = auth.viewer.organizationId;
  const text =
    kind === "gasket"
      ? gasketsToCsv(await listOwnGaskets(db, org))
      : kind === "bolting"
        ? boltingToCsv(await listOwnBolting(db, org))
        : flangesToCsv(await listOwnFlangeTemplates(db, org));
  return new Response(text, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${KIND_LABELS[kind].file}"`,
      "cache-control": "private, no-store",
    },
  });
}

export async function importCsv(request: Request, kind: LibraryKind): Promise<Response> {
  const auth = await authorizeApi(request, { role: "admin" });
  if (!auth.ok) return auth.response;
  const step = new URL(request.url).searchParams.get("step");
  if (step !== "preview" && step !== "commit") return jsonError(400, "Say ?step=preview or ?step=commit.");
  const bytes = await readBodyWithLimit(request, MAX_CSV_BYTES);
  if (bytes === null) return jsonError(413, "The CSV file is larger than 2 MB; split it.");
  const text = new TextDecoder().decode(bytes);
  if (step === "preview") {
    const parsed = parseLibraryCsv(kind, text);
    return Response.json(
      parsed.ok
        ? { ok: true, rows: parsed.rows, count: parsed.inputs.length }
        : { ok: false, message: parsed.message, rows: parsed.rows, errors: parsed.errors },
    );
  }
  const result = await importLibraryCsv(getDb(), auth.viewer.organizationId, auth.viewer.userId, kind, text);
  return Response.json(result, { status: result.ok ? 200 : 422 });
}
