import type { JointDesign, UnitSystem } from "@/features/analysis/core/design";
import { boltMaterialOf } from "@/features/analysis/core/catalogue/bolt-materials";
import { findNutHeight, MATING_NUT_GRADES } from "@/features/analysis/core/catalogue/nut-heights";
import { findNut } from "@/features/analysis/core/catalogue/nuts";
import { findThread } from "@/features/analysis/core/catalogue/threads";
import { computeStudLength, type StudLength } from "@/features/analysis/core/stud-length";
import { stringifyCsv } from "@/features/forms/csv-cells";
import { fixed, lengthUnitFor } from "./length-unit";

/**
 * The Bolting kit: what the shop draws from stores for one joint, one line per distinct item with
 * its count: studs (or bolts) with the length to order, worked out from the stored document's
 * layers, washers and nut heights plus the thread projection (core/stud-length.ts); nuts; washers.
 * Shared by the bolt-spacing sheet and the CSV, so the two never disagree.
 */
export interface KitLine {
  item: number;
  part: "stud" | "bolt" | "nut" | "washer";
  description: string;
  size: string;
  /** Length to order (studs and bolts), mm; null for nuts and washers. */
  lengthMm: number | null;
  material: string;
  quantity: number;
  /** How the line was worked out, with its tags. */
  basis: string;
}

export interface BoltingKit {
  lines: KitLine[];
  boltCount: number;
  /** The stud length worked out, with the design's entered length; null for a size without a nut height. */
  length: (StudLength & { enteredMm: number }) | null;
  /** True when a line rests on a value taken from memory (the nut heights are all [mem]). */
  usesRememberedValues: boolean;
}

/** Sum of the clamped layers, mm (the gasket's thickness from its material). */
function clampedMm(design: JointDesign): number {
  return design.layers.reduce(
    (a, l) => a + (l.role === "gasket" ? design.gasket.material.thicknessMm : l.thicknessMm),
    0,
  );
}

/** The kit of a design; sizes and the basis text in `units` (default: the design's own). */
export function buildBoltingKit(design: JointDesign, units: UnitSystem = design.units): BoltingKit {
  const f = design.fastener;
  const n = design.bolts.length;
  const metric = f.threadSeries === "metric-coarse";
  const thread = findThread(f.designation, f.threadSeries);
  const nutSeries = f.nutSeries ?? "iso-4032";
  const nutRow = findNut(f.designation, nutSeries);
  const height = thread ? findNutHeight(f.designation, thread.nominalDiameterMm, nutSeries) : undefined;
  const material = boltMaterialOf(f)?.name ?? f.materialId;
  const tapped = f.termination.kind === "tapped-hole" ? f.termination : null;
  const u = lengthUnitFor(units);
  const dec = u.suffix === "mm" ? 1 : 3;
  const len = (mm: number) => `${fixed(u.fromMm(mm), dec)} ${u.suffix}`;
  const stud =
    thread && height
      ? computeStudLength({
          form: f.form,
          termination: f.termination.kind,
          clampedMm: clampedMm(design),
          washerThicknessMm: f.washer?.thicknessMm ?? 0,
          nutHeightMm: height.heightMm,
          pitchMm: thread.pitchMm,
          nominalDiameterMm: thread.nominalDiameterMm,
          engagementMm: tapped?.engagementMm ?? null,
          metric,
          tensioner: design.assembly.method === "hydraulic-tensioner",
        })
      : null;
  const length = stud ? { ...stud, enteredMm: f.lengthMm } : null;
  const nutsPerBolt = stud?.nutsPerBolt ?? (tapped ? (f.form === "stud" ? 1 : 0) : f.form === "stud" ? 2 : 1);
  const washersPerBolt = f.washer ? (tapped ? 1 : 2) : 0;
  // "M20", or the unified size with its threads per inch and series: "3/4-10 UNC", "1-1/8-8 UN".
  const size =
    metric || !thread?.threadsPerInch
      ? f.designation
      : `${f.designation}-${thread.threadsPerInch} ${thread.series === "unc" ? "UNC" : "UN"}`;
  const per = f.form === "stud" ? "stud" : "bolt";
  const sum = stud
    ? stud.terms.map((t) => `${t.count > 1 ? `${t.count} × ` : ""}${len(t.eachMm)} ${t.label}`).join(" + ")
    : "";
  const lines: Omit<KitLine, "item">[] = [
    {
      part: f.form === "stud" ? "stud" : "bolt",
      description:
        f.form === "stud"
          ? "Stud bolt, threaded full length"
          : tapped
            ? "Hexagon head cap screw"
            : "Hexagon head bolt",
      size,
      lengthMm: length?.orderMm ?? f.lengthMm,
      material,
      quantity: n,
      basis:
        stud && height
          ? `${sum} = ${len(stud.requiredMm)}; ${stud.rule}; nut height ${height.source} [mem]; the design enters ${len(f.lengthMm)}`
          : "length as entered in the design (no nut height in the catalogue for this size)",
    },
  ];
  if (nutsPerBolt > 0)
    lines.push({
      part: "nut",
      description: metric
        ? nutSeries === "iso-old"
          ? "Hexagon nut, older ISO/DIN series"
          : "Hexagon nut, ISO 4032 style 1"
        : "Heavy hex nut, ASME B18.2.2",
      size: `${size}${nutRow ? `, across flats ${len(nutRow.acrossFlatsMm)}` : ""}${height ? `, height ${len(height.heightMm)}` : ""}`,
      lengthMm: null,
      material: MATING_NUT_GRADES[f.materialId]
        ? `${MATING_NUT_GRADES[f.materialId]} (the usual mate of the bolting [mem])`
        : `a grade to suit ${material}`,
      quantity: n * nutsPerBolt,
      basis: `${nutsPerBolt} per ${per}`,
    });
  if (f.washer && washersPerBolt > 0)
    lines.push({
      part: "washer",
      description: "Flat washer",
      size: `OD ${len(f.washer.outerDiameterMm)} × ${len(f.washer.thicknessMm)} thick, for ${size}`,
      lengthMm: null,
      material: "hardened steel to suit the bolting",
      quantity: n * washersPerBolt,
      basis: `${washersPerBolt} per ${per}, one under each ${tapped ? "nut or head" : f.form === "stud" ? "nut" : "nut and head"}`,
    });
  return {
    lines: lines.map((l, i) => ({ ...l, item: i + 1 })),
    boltCount: n,
    length,
    usesRememberedValues: !!height && height.confidence === "mem",
  };
}

/** The header cell of the kit CSV's last column while unverified table values remain. */
export const KIT_UNVERIFIED_COLUMN = "contains_unverified_table_values";

/**
 * The Bolting kit as CSV, lengths in the design's unit (`length_mm` or `length_in`), through the
 * shared formula-injection guard. A last column names unverified table values while any remain
 * (the stored result's, or the kit's own remembered nut heights).
 */
export function buildBoltingKitCsv(
  design: Pick<JointDesign, "units">,
  kit: BoltingKit,
  options: { unverified?: boolean } = {},
): string {
  const u = lengthUnitFor(design.units);
  const unverified = options.unverified || kit.usesRememberedValues;
  const header = [
    "item",
    "part",
    "description",
    "size",
    `length_${u.suffix}`,
    "material",
    "quantity",
    "basis",
    ...(unverified ? [KIT_UNVERIFIED_COLUMN] : []),
  ];
  const rows = kit.lines.map((l) => [
    String(l.item),
    l.part,
    l.description,
    l.size,
    l.lengthMm === null ? "" : fixed(u.fromMm(l.lengthMm), u.suffix === "mm" ? 1 : 3),
    l.material,
    String(l.quantity),
    l.basis,
    ...(unverified ? ["yes"] : []),
  ]);
  return stringifyCsv([header, ...rows], { record_delimiter: "\r\n" });
}
