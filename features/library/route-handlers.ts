import "server-only";
import { getDb } from "@/db/index";
import type { LibraryKind } from "@/db/tables/library";
import { authorizeApi, jsonError } from "@/server/auth/guard";
import { readBodyWithLimit } from "@/server/http/request-body";
import { KIND_LABELS } from "./model/csv-columns";
import { boltingToCsv, flangesToCsv, gasketsToCsv, parseLibraryCsv } from "./model/library-csv";
import { importLibraryCsv, planLibraryImport } from "./mutations";
import {
  listBoltingChoices,
  listFlangeTemplateChoices,
  listGasketChoices,
  listOwnBolting,
  listOwnFlangeTemplates,
  listOwnGaskets,
} from "./queries";
import { cacheControl } from "@/server/http/cache-control";

// The /api/v1/library/* handlers, shared by the three kinds. GET …/<kind>: the picker list
// (built-in − hidden + own) for any member; GET …/<kind>/csv: the organisation's own rows as CSV
// (the import format; `?variant=spreadsheet` adds a UTF-8 BOM and CRLF line ends for spreadsheet
// programs); POST …/<kind>/csv?step=preview|commit&mode=add|update: admin-only import of the file's
// bytes as the body (the encoding is detected on the server).
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
  return Response.json({ rows }, { headers: cacheControl("userData") });
}

export async function exportCsv(request: Request, kind: LibraryKind): Promise<Response> {
  const auth = await authorizeApi(request);
  if (!auth.ok) return auth.response;
  const db = getDb();
  const org = auth.viewer.organizationId;
  const variant =
    new URL(request.url).searchParams.get("variant") === "spreadsheet" ? "spreadsheet" : "plain";
  const text =
    kind === "gasket"
      ? gasketsToCsv(await listOwnGaskets(db, org), variant)
      : kind === "bolting"
        ? boltingToCsv(await listOwnBolting(db, org), variant)
        : flangesToCsv(await listOwnFlangeTemplates(db, org), variant);
  return new Response(text, {
    headers: {
      "content-type": "text/csv; charset=utf-8",
      "content-disposition": `attachment; filename="${KIND_LABELS[kind].file}"`,
      ...cacheControl("userData"),
    },
  });
}

export async function importCsv(request: Request, kind: LibraryKind): Promise<Response> {
  const auth = await authorizeApi(request, { role: "admin" });
  if (!auth.ok) return auth.response;
  const params = new URL(request.url).searchParams;
  const step = params.get("step");
  if (step !== "preview" && step !== "commit") return jsonError(400, "Say ?step=preview or ?step=commit.");
  const mode = params.get("mode") ?? "add";
  if (mode !== "add" && mode !== "update") return jsonError(400, "Say &mode=add or &mode=update.");
  const bytes = await readBodyWithLimit(request, MAX_CSV_BYTES);
  if (bytes === null) return jsonError(413, "The CSV file is larger than 2 MB; split it.");
  if (step === "preview") {
    const parsed = parseLibraryCsv(kind, bytes);
    if (!parsed.ok)
      return Response.json({ ok: false, message: parsed.message, rows: parsed.rows, errors: parsed.errors });
    const planned = await planLibraryImport(getDb(), auth.viewer.organizationId, kind, parsed, mode);
    return Response.json(
      planned.ok
        ? { ok: true, rows: parsed.rows, count: parsed.inputs.length, plan: planned.plan }
        : { ok: false, message: planned.message, rows: planned.rows, errors: planned.errors },
    );
  }
  const result = await importLibraryCsv(
    getDb(),
    auth.viewer.organizationId,
    auth.viewer.userId,
    kind,
    bytes,
    mode,
  );
  return Response.json(result, { status: result.ok ? 200 : 422 });
}
