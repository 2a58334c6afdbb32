import type { JointDesign } from "@/features/analysis/core/design";
import type { BoltRow } from "./bolt-rows";
import { stringifyCsv } from "@/features/forms/csv-cells";
import { fixed, lengthUnitFor } from "./length-unit";

/**
 * The hole list: one CSV row per bolt hole for drilling and CAD, in the design's length unit
 * (named in the header, e.g. `x_mm`). Angles are clockwise from 12 o'clock seen from the face.
 */
export function buildHoleListCsv(
  design: Pick<JointDesign, "units" | "fastener">,
  rows: readonly BoltRow[],
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
  ]);
  return stringifyCsv([header, ...records], { record_delimiter: "\r\n" });
}
