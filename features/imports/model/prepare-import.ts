// One function from the dropped files to the design that would be created, used twice: in the
// browser for the preview, and on the server (from the same file text) for the real create, so
// the confirmed preview and the stored design come from identical code.
import type { UnitSystem } from "@/features/analysis/core/design";
import { formatIssue, validateJointDesign } from "@/features/analysis/core/validate";
import { buildImportedDesign, type BuiltImport } from "./build-imported-design";
import { parseBoltCsv, type CsvRowError } from "./parse-bolt-csv";
import type { AssumedUnit } from "./dxf-units";
import { parseDxfFlange, type DxfFlangeImport, type DxfReading } from "./parse-dxf-flange";

export interface ImportSummary {
  unitsLabel: string;
  outlineText: string;
  holeCount: number;
  holeDiameterMm: number;
  boreDiameterMm: number | null;
  boltPathText: string;
  boltsFrom: "dxf" | "csv";
  /** How the CSV was read (delimiter, encoding), when one was given. */
  csvFormat: string | null;
  warnings: string[];
}

export type PreparedImport =
  | { ok: true; dxf: DxfFlangeImport; built: BuiltImport; summary: ImportSummary }
  | {
      ok: false;
      message: string;
      field: "dxf" | "csv" | "design";
      rowErrors?: CsvRowError[];
      /** What was read from the DXF, so the layer and unit choices stay on screen after a refusal. */
      reading?: DxfReading;
    };

const r1 = (v: number) => Math.round(v * 10) / 10;

export function prepareImport(input: {
  dxfText: string;
  /** The CSV as uploaded (bytes, so its encoding can be detected) or as text. */
  csv?: Uint8Array | string | null;
  csvUnit?: "mm" | "in";
  /** Layers to read (absent: the defaults) and the unit of a DXF that states none. */
  layersOn?: readonly string[];
  dxfUnit?: AssumedUnit;
  name: string;
  units: UnitSystem;
  equipmentTag?: string;
}): PreparedImport {
  const parsed = parseDxfFlange(input.dxfText, { layersOn: input.layersOn, unit: input.dxfUnit });
  if (!parsed.ok) return { ok: false, message: parsed.message, field: "dxf", reading: parsed.reading };
  const dxf = parsed.value;
  const reading = dxf.reading;
  let holes = dxf.boltHoles;
  let boltsFrom: ImportSummary["boltsFrom"] = "dxf";
  let csvFormat: string | null = null;
  if (input.csv && input.csv.length > 0) {
    const csv = parseBoltCsv(input.csv, {
      unit: input.csvUnit ?? "mm",
      defaultDiameterMm: dxf.boltHoles[0]?.diameterMm,
    });
    if (!csv.ok) return { ok: false, message: csv.message, field: "csv", rowErrors: csv.rowErrors, reading };
    // CSV coordinates are taken relative to the flange centre (the origin of the design).
    holes = csv.holes;
    boltsFrom = "csv";
    csvFormat = `${csv.format}${csv.unitFromHeader ? `, ${csv.unitFromHeader === "in" ? "inches" : "mm"} from its header` : ""}`;
  }
  const built = buildImportedDesign(
    { name: input.name || "Imported flange", units: input.units, equipmentTag: input.equipmentTag },
    { outline: dxf.outline, boltHoles: holes, bore: dxf.bore },
  );
  const issues = validateJointDesign(built.design);
  if (issues.length > 0)
    return {
      ok: false,
      message: `The imported geometry is not a valid joint: ${issues.slice(0, 3).map(formatIssue).join("; ")}. Read from the outline ${reading.outlineText} with ${holes.length} hole(s) Ø ${r1(built.holeDiameterMm)} mm${boltsFrom === "csv" ? " from the CSV" : ""}, drawing units ${dxf.unitsLabel}.`,
      field: "design",
      reading,
    };
  const o = dxf.outline;
  const xs = o.kind === "polygon" ? o.points.map((p) => p.x) : [];
  const ys = o.kind === "polygon" ? o.points.map((p) => p.y) : [];
  const outlineText =
    o.kind === "circle"
      ? `circle Ø ${r1(o.diameterMm)} mm`
      : `polygon, ${o.points.length} points, ${r1(Math.max(...xs) - Math.min(...xs))} × ${r1(Math.max(...ys) - Math.min(...ys))} mm`;
  const bp = built.design.boltPath;
  return {
    ok: true,
    dxf,
    built,
    summary: {
      unitsLabel: dxf.unitsLabel,
      outlineText,
      holeCount: holes.length,
      holeDiameterMm: built.holeDiameterMm,
      boreDiameterMm: dxf.bore?.diameterMm ?? null,
      boltPathText:
        bp.kind === "circle"
          ? `bolt circle Ø ${r1(bp.diameterMm)} mm (fitted through the hole centres)`
          : `outline offset ${r1(bp.offsetMm)} mm inward (mean edge distance of the holes)`,
      boltsFrom,
      csvFormat,
      warnings: [
        ...dxf.warnings,
        ...(built.fit.maxOffPathMm > 0.05
          ? [
              `Holes sit up to ${r1(built.fit.maxOffPathMm)} mm off the fitted bolt path; they keep their drawn positions.`,
            ]
          : []),
      ],
    },
  };
}
