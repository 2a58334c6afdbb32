import "server-only";
import { z } from "zod";

// Request plumbing of the attachment routes: the upload body is the raw file (so the browser can
// report progress and we can stop reading at the limit instead of buffering a huge form).
export const uploadHeadersSchema = z.object({
  designId: z.uuid(),
  fileName: z
    .string()
    .trim()
    .min(1, "The upload has no file name.")
    .max(255, "The file name is longer than 255 characters."),
});

export const idParamSchema = z.uuid();

/** Reads at most `limit` bytes; returns null as soon as the body is longer. */
export async function readBodyWithLimit(request: Request, limit: number): Promise<Uint8Array | null> {
  if (!request.body) return new Uint8Array(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > limit) {
      await reader.cancel();
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

export function decodeFileNameHeader(value: string | null): string {
  if (!value) return "";
  try {
    return decodeURIComponent(value);
  } catch {
    return value;
  }
}

/** RFC 6266 / 5987 Content-Disposition with an ASCII fallback. */
export function contentDisposition(fileName: string): string {
  const ascii = fileName.replace(/[^\x20-\x7e]/g, "_").replace(/["\\]/g, "_");
  return `attachment; filename="${ascii}"; filename*=UTF-8''${encodeURIComponent(fileName)}`;
}
