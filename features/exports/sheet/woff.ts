import "server-only";
import { inflateSync } from "node:zlib";

/**
 * Unpacks a WOFF 1.0 file into the plain TrueType/OpenType (sfnt) font it wraps: each table is
 * zlib-inflated (when compressed) and laid out again behind a fresh table directory.
 *
 * Why: fontkit (inside pdfkit 0.20.2) reads the IBM Plex Mono .woff files wrongly and throws
 * "Offset is outside the bounds of the DataView" on the first glyph, while the same tables as a
 * plain sfnt load fine. WOFF2 is worse (pdfkit crashes outright), so the app's .woff files are
 * unpacked here, once per process.
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.readUInt32BE(0) !== 0x774f4646) return woff; // not "wOFF": already an sfnt
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  let entrySelector = 0;
  while (2 ** (entrySelector + 1) <= numTables) entrySelector++;
  const searchRange = 16 * 2 ** entrySelector;
  const head = Buffer.alloc(12 + 16 * numTables);
  head.writeUInt32BE(flavor, 0);
  head.writeUInt16BE(numTables, 4);
  head.writeUInt16BE(searchRange, 6);
  head.writeUInt16BE(entrySelector, 8);
  head.writeUInt16BE(numTables * 16 - searchRange, 10);
  const bodies: Buffer[] = [];
  let offset = head.length;
  for (let i = 0; i < numTables; i++) {
    const e = 44 + i * 20;
    const tag = woff.readUInt32BE(e);
    const at = woff.readUInt32BE(e + 4);
    const compLength = woff.readUInt32BE(e + 8);
    const origLength = woff.readUInt32BE(e + 12);
    const checksum = woff.readUInt32BE(e + 16);
    const raw = woff.subarray(at, at + compLength);
    const data = compLength < origLength ? inflateSync(raw) : Buffer.from(raw);
    const d = 12 + i * 16;
    head.writeUInt32BE(tag, d);
    head.writeUInt32BE(checksum, d + 4);
    head.writeUInt32BE(offset, d + 8);
    head.writeUInt32BE(origLength, d + 12);
    const pad = (4 - (data.length % 4)) % 4;
    bodies.push(data, Buffer.alloc(pad));
    offset += data.length + pad;
  }
  return Buffer.concat([head, ...bodies]);
}
