import "server-only";
import { z } from "zod";
import { plainText } from "@/features/forms/plain-text";

// Request plumbing of the attachment routes: the upload body is the raw file (so the browser can
// report progress and we can stop reading at the limit instead of buffering a huge form).
export const uploadHeadersSchema = z.object({
  designId: z.uuid(),
  fileName: plainText()
    .trim()
    .min(1, "The upload has no file name.")
    .max(255, "The file name is longer than 255 characters."),
});

export const idParamSchema = z.uuid();

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
