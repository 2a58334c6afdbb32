import "server-only";
import type { JointDesign } from "@/features/analysis/core/design";
import type { SheetUnits } from "./format";
import { boltMaterialOf } from "@/features/analysis/core/catalogue/bolt-materials";

const METHOD: Record<string, string> = {
  "torque-wrench": "Torque wrench",
  "turn-of-nut": "Turn of nut",
  "hydraulic-tensioner": "Hydraulic tensioner",
  "load-indicating-washer": "Load-indicating washer",
  "bolt-elongation": "Bolt elongation",
  ultrasonic: "Ultrasonic elongation",
};

/** The design inputs printed beside the drawing (from the stored document, formatted only). */
export function jointDataItems(d: JointDesign, u: SheetUnits): { label: string; value: string }[] {
  const L = (mm: number) => `${u.len(mm)} ${u.length}`;
  const o = d.outline;
  const outline =
    o.kind === "circle"
      ? `circle Ø${L(o.diameterMm)}`
      : o.kind === "rectangle"
        ? `rectangle ${u.len(o.widthMm)} × ${L(o.heightMm)}, r ${L(o.cornerRadiusMm)}`
        : o.kind === "obround"
          ? `obround ${u.len(o.lengthMm)} × ${L(o.widthMm)}`
          : `polygon, ${o.points.length} corners`;
  const b = d.bore;
  const bore = !b
    ? "none"
    : b.kind === "circle"
      ? `Ø${L(b.diameterMm)}`
      : b.kind === "rectangle"
        ? `${u.len(b.widthMm)} × ${L(b.heightMm)}`
        : b.kind === "obround"
          ? `${u.len(b.lengthMm)} × ${L(b.widthMm)}`
          : "polygon";
  const g = d.gasket;
  const gasketGeom =
    g.kind === "full-face"
      ? "full face"
      : g.geometry.kind === "annulus"
        ? `ID ${u.len(g.geometry.innerDiameterMm)} / OD ${L(g.geometry.outerDiameterMm)}`
        : `band ${L(g.geometry.widthMm)} wide, centre ${L(g.geometry.centreOffsetMm)} in`;
  const p = d.assembly.preload;
  const preload =
    p.kind === "fraction-of-proof"
      ? `${p.value} × proof load`
      : p.kind === "fraction-of-yield"
        ? `${p.value} × yield`
        : `${u.stress1(p.value)} ${u.stress} bolt stress`;
  return [
    { label: "Outline", value: outline },
    { label: "Bore / opening", value: bore },
    {
      label: "Bolt path",
      value:
        d.boltPath.kind === "circle"
          ? `circle Ø${L(d.boltPath.diameterMm)}`
          : `outline offset ${L(d.boltPath.offsetMm)}`,
    },
    { label: "Bolts", value: `${d.bolts.length} × ${d.fastener.designation} ${d.fastener.form}` },
    {
      label: "Bolt material",
      value: boltMaterialOf(d.fastener)?.name ?? d.fastener.materialId,
    },
    { label: "Hole diameter", value: L(d.fastener.holeDiameterMm) },
    { label: "Fastener length", value: L(d.fastener.lengthMm) },
    { label: "Gasket", value: g.material.name },
    { label: "Gasket geometry", value: gasketGeom },
    { label: "Gasket m / y", value: `${g.material.m} / ${u.stress1(g.material.yMpa)} ${u.stress}` },
    { label: "Preload rule", value: preload },
    { label: "Nut factor K", value: `${d.assembly.nutFactor.value}` },
    { label: "Tightening method", value: METHOD[d.assembly.method] ?? d.assembly.method },
    { label: "Design pressure", value: `${u.stress1(d.loads.designPressureMpa)} ${u.stress}` },
    {
      label: "Design temperature",
      value:
        u.system === "US"
          ? `${((d.loads.designTemperatureC * 9) / 5 + 32).toFixed(0)} °F`
          : `${d.loads.designTemperatureC} °C`,
    },
  ];
}
