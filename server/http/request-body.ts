import "server-only";
import { jsonError } from "@/server/auth/guard";

// Reading request bodies at the HTTP edge, for every route handler that takes one: a body is read
// only up to its limit (a declared Content-Length over it is refused before reading, a chunked
// body is cut off as soon as it passes it), and a JSON body is refused when it nests deeper than
// any document of ours does, before JSON.parse and before any recursive code sees it. Every
// refusal is a JSON 4xx with a message, never a 500.

/** Largest JSON body: a 512-bolt design with two 4,096-point polygon outlines is about 0.4 MB. */
export const MAX_JSON_BODY_BYTES = 1024 * 1024;
/** Deepest nesting of arrays and objects: a design document nests 6 levels deep. */
export const MAX_JSON_DEPTH = 64;

export type BodyRead<T> = { ok: true; body: T } | { ok: false; response: Response };

/** Reads at most `limit` bytes; returns null as soon as the body is (or is declared) longer. */
export async function readBodyWithLimit(request: Request, limit: number): Promise<Uint8Array | null> {
  const declared = Number(request.headers.get("content-length") ?? "");
  if (Number.isFinite(declared) && declared > limit) {
    await request.body?.cancel().catch(() => undefined);
    return null;
  }
  if (!request.body) return new Uint8Array(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel().catch(() => undefined);
      return null;
    }
    chunks.push(value);
  }
  const out = new Uint8Array(total);
  let offset = 0;
  for (const c of chunks) {
    out.set(c, offset);
    offset += c.byteLength;
  }
  return out;
}

const megabytes = (bytes: number) => `${Math.round((bytes / (1024 * 1024)) * 10) / 10} MB`;

/** The deepest nesting of [ and { in a JSON text, ignoring brackets inside strings; stops past `cap`. */
export function jsonNestingDepth(text: string, cap = Infinity): number {
  let depth = 0;
  let deepest = 0;
  let inString = false;
  for (let i = 0; i < text.length; i++) {
    const c = text.charCodeAt(i);
    if (inString) {
      if (c === 0x5c)
        i++; // backslash: skip the escaped character
      else if (c === 0x22) inString = false;
    } else if (c === 0x22) inString = true;
    else if (c === 0x7b || c === 0x5b) {
      depth++;
      if (depth > deepest) {
        deepest = depth;
        if (deepest > cap) return deepest;
      }
    } else if (c === 0x7d || c === 0x5d) depth--;
  }
  return deepest;
}

/**
 * The body as JSON: 413 over `maxBytes`, 400 when it is not UTF-8 JSON or nests deeper than
 * MAX_JSON_DEPTH. The one JSON body reader of the route handlers.
 */
export async function readJsonBody(
  request: Request,
  options: { maxBytes?: number } = {},
): Promise<BodyRead<unknown>> {
  const maxBytes = options.maxBytes ?? MAX_JSON_BODY_BYTES;
  const bytes = await readBodyWithLimit(request, maxBytes);
  if (bytes === null)
    return {
      ok: false,
      response: jsonError(413, `The request body is larger than ${megabytes(maxBytes)}; send less.`),
    };
  let text: string;
  try {
    text = new TextDecoder("utf-8", { fatal: true }).decode(bytes);
  } catch {
    return { ok: false, response: jsonError(400, "The request body must be JSON in UTF-8.") };
  }
  if (jsonNestingDepth(text, MAX_JSON_DEPTH) > MAX_JSON_DEPTH)
    return {
      ok: false,
      response: jsonError(
        400,
        `The JSON body nests arrays and objects more than ${MAX_JSON_DEPTH} levels deep; no document of ours does.`,
      ),
    };
  try {
    return { ok: true, body: JSON.parse(text) as unknown };
  } catch {
    return { ok: false, response: jsonError(400, "The request body must be JSON.") };
  }
}
