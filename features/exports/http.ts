import "server-only";
import { attachmentDisposition } from "./file-names";
import { exportPathSchema, sheetOptionsSchema, type ExportPathInput, type SheetOptionsInput } from "./schema";
import { fieldErrorsOf } from "@/features/forms/form-data";
import { cacheControl } from "@/server/http/cache-control";

// Request plumbing shared by the export route handlers (parse, answer with a file).
export type ParseResult<T> =
  { ok: true; data: T } | { ok: false; message: string; fieldErrors: Record<string, string[]> };

export function parseExportPath(params: { designId: string; number: string }): ExportPathInput | null {
  const parsed = exportPathSchema.safeParse(params);
  return parsed.success ? parsed.data : null;
}

/** ?paper=a4|letter&units=SI|US (units default to the viewer's choice, decided by the caller). */
export function parseSheetOptions(url: URL): ParseResult<SheetOptionsInput> {
  const raw = Object.fromEntries(
    ["paper", "units"].flatMap((k) => (url.searchParams.has(k) ? [[k, url.searchParams.get(k)]] : [])),
  );
  const parsed = sheetOptionsSchema.safeParse(raw);
  if (parsed.success) return { ok: true, data: parsed.data };
  return {
    ok: false,
    message: "The export options are not valid.",
    fieldErrors: fieldErrorsOf(parsed.error),
  };
}

export function fileResponse(body: Uint8Array | string, fileName: string, contentType: string): Response {
  const bytes = typeof body === "string" ? new TextEncoder().encode(body) : body;
  return new Response(new Uint8Array(bytes), {
    headers: {
      "content-type": contentType,
      "content-length": String(bytes.byteLength),
      "content-disposition": attachmentDisposition(fileName),
      "x-content-type-options": "nosniff",
      ...cacheControl("userData"),
    },
  });
}
