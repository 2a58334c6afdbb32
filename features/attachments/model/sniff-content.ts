// Decides what a file is from its first bytes, never from its name or the browser's declared
// type (both are the uploader's word). Only the four kinds we accept are recognised.
export type SniffedKind = "pdf" | "png" | "jpeg" | "dxf";

export const CONTENT_TYPES: Record<SniffedKind, string> = {
  pdf: "application/pdf",
  png: "image/png",
  jpeg: "image/jpeg",
  dxf: "image/vnd.dxf",
};

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

function startsWith(bytes: Uint8Array, prefix: number[]): boolean {
  return bytes.length >= prefix.length && prefix.every((b, i) => bytes[i] === b);
}

/** ASCII DXF: optional whitespace, group code 0, a line break, then SECTION (e.g. "  0\r\nSECTION"). */
function looksLikeDxf(bytes: Uint8Array): boolean {
  let head = "";
  const n = Math.min(bytes.length, 64);
  for (let i = 0; i < n; i++) head += String.fromCharCode(bytes[i]);
  if (head.charCodeAt(0) === 0xef && head.charCodeAt(1) === 0xbb && head.charCodeAt(2) === 0xbf)
    head = head.slice(3);
  return /^\s*0[ \t]*\r?\n[ \t]*SECTION[ \t]*\r?\n/.test(head);
}

export function sniffContent(bytes: Uint8Array): SniffedKind | null {
  if (startsWith(bytes, [0x25, 0x50, 0x44, 0x46, 0x2d])) return "pdf"; // %PDF-
  if (startsWith(bytes, PNG_SIGNATURE)) return "png";
  if (startsWith(bytes, [0xff, 0xd8, 0xff])) return "jpeg";
  if (looksLikeDxf(bytes)) return "dxf";
  return null;
}
