import { execFileSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { inflateSync } from "node:zlib";
import { analyzeJoint, type JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import { getBoltPathLengthMm, placeBoltsEqually } from "@/features/analysis/core/geometry";
import type { SheetInput } from "@/features/exports/sheet/sheet-input";
import type { ShopRevisionFacts } from "@/features/exports/shop-files";

// Shared helpers of the export suites: the example documents, a 96-bolt flange built from one by
// re-placing its bolts with the core's geometry helper, and poppler (pdftotext/pdftoppm) wrappers.
export function loadExample(
  name: "pipe-flange-nps6-spiral-wound" | "obround-manway" | "rectangular-cover-full-face",
): JointDesign {
  return JSON.parse(
    readFileSync(path.join(process.cwd(), "examples", `${name}.json`), "utf8"),
  ) as JointDesign;
}

/** A large girth flange: the NPS 6 example scaled up and re-drilled with `count` bolts. */
export function manyBoltFlange(count = 96): JointDesign {
  const base = loadExample("pipe-flange-nps6-spiral-wound");
  const design: JointDesign = {
    ...base,
    name: `Girth flange, ${count} bolts`,
    units: "SI",
    outline: { kind: "circle", diameterMm: 2300 },
    bore: { kind: "circle", diameterMm: 2000 },
    gasket:
      base.gasket.kind === "ring"
        ? { ...base.gasket, geometry: { kind: "annulus", innerDiameterMm: 2010, outerDiameterMm: 2120 } }
        : base.gasket,
    boltPath: { kind: "circle", diameterMm: 2200 },
    bolts: [],
  };
  return { ...design, bolts: placeBoltsEqually(getBoltPathLengthMm(design), count) };
}

export function analyse(design: JointDesign): JointAnalysis {
  return analyzeJoint(design);
}

export function sheetInputFor(
  design: JointDesign,
  overrides: Partial<SheetInput> & { status?: SheetInput["revision"]["status"] } = {},
): SheetInput {
  const { status, ...rest } = overrides;
  return {
    design: { name: design.name, equipmentTag: "E-2107" },
    revision: {
      number: 7,
      status: status ?? "approved",
      designer: "Dana Designer",
      approver: status && status !== "approved" ? null : "Arlo Approver",
      approvedAt: status && status !== "approved" ? null : "2026-11-30T09:15:00.000Z",
      contentHash: "4be1c0ffee5eed0123456789abcdef0123456789abcdef0123456789abcdef01",
    },
    document: design,
    result: analyse(design),
    justifications: [],
    paper: "a4",
    units: "SI",
    createdAt: new Date("2026-12-01T08:00:00.000Z"),
    ...rest,
  };
}

/** The stored revision's facts the drilling template names, as `sheetInputFor` has them. */
export function revisionFactsFor(
  design: JointDesign,
  status: SheetInput["revision"]["status"] = "approved",
): ShopRevisionFacts {
  return {
    designName: design.name,
    equipmentTag: "E-2107",
    number: 7,
    status,
    approvedAt: status === "approved" ? "2026-11-30T09:15:00.000Z" : null,
    approverName: status === "approved" ? "Arlo Approver" : null,
  };
}

/** The export date the shop-file tests use. */
export const EXPORTED_AT = new Date("2026-12-01T08:00:00.000Z");

/** Runs fn with a fresh temporary folder, removed afterwards. */
export function withTempDir<T>(fn: (dir: string) => T): T {
  const dir = mkdtempSync(path.join(tmpdir(), "sealpitch-exports-"));
  try {
    return fn(dir);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}

export function pdfToText(
  pdf: Buffer,
  options: { first?: number; last?: number; layout?: boolean } = {},
): string {
  return withTempDir((dir) => {
    const file = path.join(dir, "sheet.pdf");
    writeFileSync(file, pdf);
    const args = [
      ...(options.layout ? ["-layout"] : []),
      ...(options.first ? ["-f", String(options.first)] : []),
      ...(options.last ? ["-l", String(options.last)] : []),
      file,
      "-",
    ];
    return execFileSync("/usr/bin/pdftotext", args, { encoding: "utf8" });
  });
}

export interface PdfWord {
  text: string;
  xMin: number;
  yMin: number;
  xMax: number;
  yMax: number;
}

/** Words of one page with their boxes (points, origin top left), from `pdftotext -bbox`. */
export function pdfWords(pdf: Buffer, page: number): { width: number; height: number; words: PdfWord[] } {
  const html = withTempDir((dir) => {
    const file = path.join(dir, "sheet.pdf");
    writeFileSync(file, pdf);
    return execFileSync("/usr/bin/pdftotext", ["-bbox", "-f", String(page), "-l", String(page), file, "-"], {
      encoding: "utf8",
    });
  });
  const pageTag = /<page width="([\d.]+)" height="([\d.]+)"/.exec(html);
  const words: PdfWord[] = [];
  const re = /<word xMin="([\d.]+)" yMin="([\d.]+)" xMax="([\d.]+)" yMax="([\d.]+)">([^<]*)<\/word>/g;
  for (let m = re.exec(html); m; m = re.exec(html))
    words.push({ xMin: +m[1], yMin: +m[2], xMax: +m[3], yMax: +m[4], text: m[5] });
  return { width: pageTag ? +pageTag[1] : 0, height: pageTag ? +pageTag[2] : 0, words };
}

export function pdfPageCount(pdf: Buffer): number {
  return withTempDir((dir) => {
    const file = path.join(dir, "sheet.pdf");
    writeFileSync(file, pdf);
    const info = execFileSync("/usr/bin/pdfinfo", [file], { encoding: "utf8" });
    return Number(/Pages:\s+(\d+)/.exec(info)?.[1] ?? 0);
  });
}

export interface Raster {
  width: number;
  height: number;
  /** Luminance 0…255, row-major. */
  gray: Uint8Array;
}

/** Page 1 at `dpi` as PNG (pdftoppm -png), decoded here (8-bit RGB/RGBA/gray, not interlaced). */
export function renderFirstPagePng(pdf: Buffer, dpi = 50): { png: Buffer; raster: Raster } {
  const png = withTempDir((dir) => {
    const file = path.join(dir, "sheet.pdf");
    writeFileSync(file, pdf);
    execFileSync("/usr/bin/pdftoppm", [
      "-r",
      String(dpi),
      "-png",
      "-f",
      "1",
      "-l",
      "1",
      "-singlefile",
      file,
      path.join(dir, "page"),
    ]);
    return readFileSync(path.join(dir, "page.png"));
  });
  return { png, raster: decodePng(png) };
}

export function decodePng(png: Buffer): Raster {
  if (png.readUInt32BE(0) !== 0x89504e47) throw new Error("not a PNG");
  let offset = 8;
  let width = 0;
  let height = 0;
  let colourType = 0;
  const idat: Buffer[] = [];
  while (offset < png.length) {
    const length = png.readUInt32BE(offset);
    const type = png.toString("ascii", offset + 4, offset + 8);
    const data = png.subarray(offset + 8, offset + 8 + length);
    if (type === "IHDR") {
      width = data.readUInt32BE(0);
      height = data.readUInt32BE(4);
      if (data[8] !== 8 || data[12] !== 0) throw new Error("only 8-bit, non-interlaced PNGs");
      colourType = data[9];
    } else if (type === "IDAT") idat.push(data);
    offset += 12 + length;
  }
  const channels =
    colourType === 2 ? 3 : colourType === 6 ? 4 : colourType === 0 ? 1 : colourType === 4 ? 2 : 0;
  if (!channels) throw new Error(`PNG colour type ${colourType} not handled`);
  const raw = inflateSync(Buffer.concat(idat));
  const stride = width * channels;
  const out = new Uint8Array(stride * height);
  for (let y = 0; y < height; y++) {
    const filter = raw[y * (stride + 1)];
    const line = raw.subarray(y * (stride + 1) + 1, (y + 1) * (stride + 1));
    for (let x = 0; x < stride; x++) {
      const a = x >= channels ? out[y * stride + x - channels] : 0;
      const b = y > 0 ? out[(y - 1) * stride + x] : 0;
      const c = x >= channels && y > 0 ? out[(y - 1) * stride + x - channels] : 0;
      let v = line[x];
      if (filter === 1) v += a;
      else if (filter === 2) v += b;
      else if (filter === 3) v += (a + b) >> 1;
      else if (filter === 4) {
        const p = a + b - c;
        const pa = Math.abs(p - a);
        const pb = Math.abs(p - b);
        const pc = Math.abs(p - c);
        v += pa <= pb && pa <= pc ? a : pb <= pc ? b : c;
      }
      out[y * stride + x] = v & 0xff;
    }
  }
  const gray = new Uint8Array(width * height);
  for (let i = 0; i < width * height; i++) {
    const px = out.subarray(i * channels, i * channels + channels);
    gray[i] = channels >= 3 ? Math.round(0.299 * px[0] + 0.587 * px[1] + 0.114 * px[2]) : px[0];
  }
  return { width, height, gray };
}
