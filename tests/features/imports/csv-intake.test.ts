import { readFileSync } from "node:fs";
import { join } from "node:path";
import Drawing from "dxf-writer";
import { describe, expect, it } from "vitest";
import type { JointDesign } from "@/features/analysis/core/design";
import { getBoltPoints } from "@/features/analysis/core/geometry";
import { buildBoltRows } from "@/features/exports/model/bolt-rows";
import { buildHoleListCsv } from "@/features/exports/model/hole-list";
import { parseBoltCsv } from "@/features/imports/model/parse-bolt-csv";
import { prepareImport } from "@/features/imports/model/prepare-import";
import {
  decodeCsvBytes,
  normaliseNumberCell,
  readSpreadsheetCsv,
  sniffDelimiter,
  unneutralise,
} from "@/features/forms/spreadsheet-csv";
import { parseLibraryCsv } from "@/features/library/model/library-csv";

// CSV as spreadsheet programs write it. Fixture files come from tests/fixtures/intake/
// generate-fixtures.ts (bytes written by hand there, Windows-1252 by iconv-lite), never from
// Sealpitch's own writer; the round trips below start from Sealpitch's own exports on purpose.
const DIR = join(process.cwd(), "tests/fixtures/intake");
const bytes = (name: string) => new Uint8Array(readFileSync(join(DIR, name)));
const manifest = JSON.parse(readFileSync(join(DIR, "manifest.json"), "utf8"));
const examples = ["pipe-flange-nps6-spiral-wound", "rectangular-cover-full-face", "obround-manway"].map(
  (n) => JSON.parse(readFileSync(join(process.cwd(), "examples", `${n}.json`), "utf8")) as JointDesign,
);

describe("spreadsheet CSV reading", () => {
  it("detects the delimiter, honours a sep= line, and reads decimal commas only with ; or tab", () => {
    expect(sniffDelimiter("a;b;c\n1,5;2;3\n").delimiter).toBe(";");
    expect(sniffDelimiter("a,b,c\n1,2,3\n").delimiter).toBe(",");
    expect(sniffDelimiter("a\tb\n1,5\t2\n").delimiter).toBe("\t");
    expect(sniffDelimiter('"x;y",b,c\n1,2,3\n').delimiter).toBe(",");
    expect(sniffDelimiter("sep=;\nx;y\n")).toEqual({ delimiter: ";", skipFirstLine: true });
    expect(normaliseNumberCell("12,5", true)).toBe("12.5");
    expect(normaliseNumberCell("1.234,5", true)).toBe("1234.5");
    expect(normaliseNumberCell("-0,75", true)).toBe("-0.75");
    expect(normaliseNumberCell("1.200", true)).toBe("1200");
    expect(normaliseNumberCell("12,5", false)).toBe("12,5");
    expect(normaliseNumberCell("abc", true)).toBe("abc");
  });

  it("decodes UTF-8, UTF-8 with BOM, UTF-16 and Windows-1252; refuses undecodable bytes and U+FFFD", () => {
    expect(decodeCsvBytes(new TextEncoder().encode("°C"))).toEqual({
      ok: true,
      text: "°C",
      encoding: "UTF-8",
    });
    expect(decodeCsvBytes(Uint8Array.from([0xef, 0xbb, 0xbf, 0x41]))).toMatchObject({
      text: "A",
      encoding: "UTF-8 with BOM",
    });
    expect(decodeCsvBytes(Uint8Array.from([0xff, 0xfe, 0xb0, 0x00, 0x43, 0x00]))).toMatchObject({
      text: "°C",
      encoding: "UTF-16 LE",
    });
    // Windows-1252 0x80 is €, 0x96 an en dash, 0xB0 °, 0xB5 µ (the code page's published table).
    expect(decodeCsvBytes(Uint8Array.from([0x80, 0x96, 0xb0, 0xb5]))).toEqual({
      ok: true,
      text: "€–°µ",
      encoding: "Windows-1252",
    });
    const w = readSpreadsheetCsv(bytes("gaskets-windows-1252.csv"));
    if (!w.ok) throw new Error(w.message);
    expect(w.encoding).toBe("Windows-1252");
    expect(w.records[1][0]).toBe(manifest["gaskets-windows-1252.csv"].name);
    expect(w.records[1][15]).toBe(manifest["gaskets-windows-1252.csv"].source);
    expect(readSpreadsheetCsv(bytes("gaskets-undecodable.csv"))).toEqual({
      ok: false,
      message: expect.stringMatching(/neither UTF-8 nor Windows-1252 \(byte 0x81 on line 2\)/),
    });
    expect(readSpreadsheetCsv(bytes("gaskets-replacement-char.csv"))).toEqual({
      ok: false,
      message: expect.stringMatching(/Line 2 holds the replacement character/),
    });
    // Already-decoded text carrying U+FFFD is refused too (the browser's File.text() makes it).
    expect(readSpreadsheetCsv("name\nGraphite 23 \uFFFDC\n").ok).toBe(false);
  });

  it("reads cells that a writer neutralised against formula injection back to their text", () => {
    for (const original of ["=SUM(A1)", "+49 tag", "-12 note", "@home", "\tindent"])
      expect(unneutralise(`'${original}`)).toBe(original);
    expect(unneutralise("'plain quote")).toBe("'plain quote");
    const csv = readSpreadsheetCsv("name,source\n'=Halden ring,'-from sheet 4\n");
    if (!csv.ok) throw new Error(csv.message);
    expect(csv.records[1]).toEqual(["=Halden ring", "-from sheet 4"]);
  });

  it("reads the semicolon, decimal-comma gasket fixture with its quoted semicolon", () => {
    const r = parseLibraryCsv("gasket", bytes("gaskets-semicolon-decimal-comma.csv"));
    if (!r.ok) throw new Error(r.message);
    expect(r.format).toBe("semicolon-separated, UTF-8, decimal commas accepted");
    const want = manifest["gaskets-semicolon-decimal-comma.csv"].rows;
    expect(r.inputs.map((i) => i.input)).toEqual([
      expect.objectContaining(want[0]),
      expect.objectContaining(want[1]),
    ]);
  });

  it("names the delimiter when a header does not match", () => {
    const r = parseLibraryCsv("gasket", "name|gasket_type\nA|b\n");
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.message).toMatch(/It was read as comma-separated, UTF-8/);
  });
});

describe("bolt positions CSV as spreadsheets and Sealpitch write it", () => {
  it("reads the BOM+CRLF fixture and the sep=; decimal-comma fixture", () => {
    const a = parseBoltCsv(bytes("bolt-positions-bom-crlf.csv"));
    if (!a.ok) throw new Error(a.message);
    expect(a.holes.map((h) => [h.xMm, h.yMm])).toEqual(manifest["bolt-positions-bom-crlf.csv"].holes);
    expect(a.holes.every((h) => h.diameterMm === manifest["bolt-positions-bom-crlf.csv"].d)).toBe(true);
    const b = parseBoltCsv(bytes("bolt-positions-semicolon.csv"));
    if (!b.ok) throw new Error(b.message);
    expect(b.holes.map((h) => [h.xMm, h.yMm])).toEqual(manifest["bolt-positions-semicolon.csv"].holes);
    expect(b.holes.every((h) => h.diameterMm === manifest["bolt-positions-semicolon.csv"].d)).toBe(true);
    expect(b.format).toBe("semicolon-separated, UTF-8, decimal commas accepted");
  });

  it("round trip: every example's hole list (mm and inch) reads back to its bolt positions within 0.001 mm", () => {
    for (const design of examples) {
      for (const units of ["SI", "US"] as const) {
        const d = { ...design, units };
        const rows = buildBoltRows(d);
        const csv = buildHoleListCsv(d, rows);
        expect(csv.split("\r\n")[0]).toContain(units === "SI" ? "x_mm,y_mm" : "x_in,y_in");
        // The intake's unit select says mm; the header's _in must win.
        const r = parseBoltCsv(csv, { unit: "mm" });
        if (!r.ok) throw new Error(`${design.name} ${units}: ${r.message}`);
        expect(r.unitFromHeader).toBe(units === "SI" ? "mm" : "in");
        expect(r.holes).toHaveLength(rows.length);
        r.holes.forEach((h, i) => {
          expect(Math.hypot(h.xMm - rows[i].xMm, h.yMm - rows[i].yMm)).toBeLessThan(1e-3);
          expect(Math.abs(h.diameterMm - d.fastener.holeDiameterMm)).toBeLessThan(1e-3);
        });
      }
    }
  });

  it("the Drawing intake takes a hole list as the bolt positions", () => {
    const design = examples[0];
    const csv = buildHoleListCsv(design, buildBoltRows(design));
    const d = new Drawing();
    d.setUnits("Millimeters");
    const od = design.outline.kind === "circle" ? design.outline.diameterMm : 300;
    d.drawCircle(0, 0, od / 2);
    // The drawing's own holes are off by 1 mm; the hole list's positions must replace them.
    for (const p of getBoltPoints(design)) d.drawCircle(p.x + 1, p.y, design.fastener.holeDiameterMm / 2);
    const r = prepareImport({ dxfText: d.toDxfString(), csv, name: "From hole list", units: "SI" });
    if (!r.ok) throw new Error(r.message);
    expect(r.summary.boltsFrom).toBe("csv");
    const want = getBoltPoints(design);
    const got = getBoltPoints(r.built.design);
    expect(got).toHaveLength(want.length);
    for (const p of want)
      expect(Math.min(...got.map((q) => Math.hypot(q.x - p.x, q.y - p.y)))).toBeLessThan(1e-3);
  });
});
