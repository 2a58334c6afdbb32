import type { JointDesign } from "@/features/analysis/core/design";
import type { BoltRow } from "./bolt-rows";
import { stringifyCsv } from "@/features/forms/csv-cells";
import { fixed, lengthUnitFor } from "./length-unit";
import { UNVERIFIED_MARK } from "@/features/analysis/unverified-values";

/** The hole list's header cell while unverified table values remain ("contains_unverified_table_values"). */
export const UNVERIFIED_COLUMN = UNVERIFIED_MARK.replace(/ /g, "_");

/**
 * The hole list: one CSV row per bolt hole for drilling and CAD, in the design's length unit
 * (named in the header, e.g. `x_mm`). Angles are clockwise from 12 o'clock seen from the face.
 */
export function buildHoleListCsv(
  design: Pick<JointDesign, "units" | "fastener">,
  rows: readonly BoltRow[],
  options: { unverified?: boolean } = {},
): string {
  const u = lengthUnitFor(design.units);
  const header = [
    "number",
    "id",
    "angle_deg_cw_from_top",
    `x_${u.suffix}`,
    `y_${u.suffix}`,
    `hole_diameter_${u.suffix}`,
    "bolt_size",
    "tightening_order",
    // While the result holds table values from memory the header says so (a column of its own, so
    // readers of the file, our bolt CSV intake among them, keep working).
    ...(options.unverified ? [UNVERIFIED_COLUMN] : []),
  ];
  const hole = fixed(u.fromMm(design.fastener.holeDiameterMm), u.decimals);
  const records = rows.map((r) => [
    String(r.number),
    r.id,
    fixed(r.angleDeg, 4),
    fixed(u.fromMm(r.xMm), u.decimals),
    fixed(u.fromMm(r.yMm), u.decimals),
    hole,
    design.fastener.designation,
    r.tighteningOrder === null ? "" : String(r.tighteningOrder),
    ...(options.unverified ? ["yes"] : []),
  ]);
  return stringifyCsv([header, ...records], { record_delimiter: "\r\n" });
}
