/**
 * Operating case at design temperature: the bolts and the clamped plates heat to the design
 * temperature together [practice: uniform temperature], so
 * - their moduli fall to E(T) (ASME II-D Table TM-1 [mem]): the springs in series soften, and the
 *   elastic interference set at bolt-up, δ0 = F0·(1/kb + 1/km), now carries F = δ0·k(T);
 * - they expand by different amounts (ASME II-D Table TE-1 mean coefficients [mem]):
 *   δth = (Σ αi·ti − αb·grip)·(T − 20 °C), which adds δth·k(T) to every bolt (a stainless flange on
 *   alloy-steel bolts gains load, the reverse loses it).
 * F(T) = (δ0 + δth)·k(T) with 1/k(T) = 1/(kb·Eb(T)/Eb(20)) + 1/(km·Ef(T)/Ef(20)); the gasket's own
 * spring is scaled with the flange modulus [practice]. Units: mm, N, °C.
 */
import type { JointModel } from "../joint-model";
import type { AsmeAppendix2Result } from "../checks/asme-appendix2";
import { makeCheck, type CheckRecord } from "../checks/check-record";
import {
  AMBIENT_TEMPERATURE_C,
  getFlangeMaterialById,
  valueAtTemperature,
} from "../catalogue/flange-materials";

/** Bolting families for α and E(T) [mem: II-D TE-1, TM-1]: austenitic B8 classes, else carbon/low-alloy steel. */
function boltFamily(materialId: string): { alpha: number; modulusRowId: string; label: string } {
  return materialId.startsWith("astm-a193-b8")
    ? { alpha: 16.6e-6, modulusRowId: "sa-182-f304", label: "austenitic stainless bolting" }
    : { alpha: 12.0e-6, modulusRowId: "sa-105", label: "carbon and low-alloy steel bolting" };
}

export interface ThermalCase {
  temperatureC: number;
  deltaTK: number;
  boltAlpha: number;
  memberGrowthMm: number;
  boltGrowthMm: number;
  interferenceChangeMm: number;
  stiffnessRatio: number;
  /** Per bolt, N: at bolt-up (minimum preload) and at design temperature. */
  minPreloadN: number;
  minAtTemperatureN: number;
  maxAtTemperatureN: number;
  source: string;
}

export function computeThermalCase(
  model: JointModel,
  asme: AsmeAppendix2Result,
): { result: ThermalCase | null; reason: string | null; checks: CheckRecord[] } {
  const d = model.design;
  const T = d.loads.designTemperatureC;
  const fd = d.flangeDesign;
  const na = (reason: string) => ({
    result: null,
    reason,
    checks: [
      makeCheck({
        id: "flange.thermal.bolt-load",
        title: "Bolt load at design temperature (differential expansion) ≥ Wm1",
        value: null,
        limit: null,
        unit: "N",
        status: "not-applicable" as const,
        source: "ASME VIII-1 Appendix 2 Wm1; bolts and members as springs in series [calc]",
        note: reason,
      }),
    ],
  });
  const flangeRow = fd?.flangeMaterialId ? getFlangeMaterialById(fd.flangeMaterialId) : undefined;
  const coverRow = fd?.coverMaterialId ? getFlangeMaterialById(fd.coverMaterialId) : undefined;
  const plates = d.layers.filter((l) => l.role !== "gasket") as {
    role: "flange" | "cover";
    thicknessMm: number;
  }[];
  const rowOf = (role: "flange" | "cover") => (role === "cover" ? (coverRow ?? flangeRow) : flangeRow);
  if (plates.some((p) => !rowOf(p.role)))
    return na("Pick the flange (and cover) material to compute the operating case at design temperature.");
  const bolt = boltFamily(d.fastener.materialId);
  const boltE = getFlangeMaterialById(bolt.modulusRowId)!.modulus;
  const ratio = (rows: readonly (readonly [number, number])[]) => {
    const eT = valueAtTemperature(rows, T);
    const e0 = valueAtTemperature(rows, AMBIENT_TEMPERATURE_C);
    return eT === null || e0 === null ? null : eT / e0;
  };
  const rb = ratio(boltE);
  const rm = ratio(rowOf(plates[0].role)!.modulus);
  if (rb === null || rm === null) return na(`${T} °C is above the modulus tables of the catalogue.`);
  const dT = T - AMBIENT_TEMPERATURE_C;
  const memberGrowthMm = plates.reduce((a, p) => a + rowOf(p.role)!.expansionPerK * p.thicknessMm * dT, 0);
  const boltGrowthMm = bolt.alpha * model.gripMm * dT;
  const interferenceChangeMm = memberGrowthMm - boltGrowthMm;
  const kb = model.boltStiffnessNPerMm;
  const km = model.memberStiffnessNPerMm;
  const k0 = 1 / (1 / kb + 1 / km);
  const kT = 1 / (1 / (kb * rb) + 1 / (km * rm));
  const at = (f0: number) => Math.max(0, (f0 / k0 + interferenceChangeMm) * kT);
  const p = model.preload;
  const n = model.boltPoints.length;
  const minAt = at(p.minN);
  const result: ThermalCase = {
    temperatureC: T,
    deltaTK: dT,
    boltAlpha: bolt.alpha,
    memberGrowthMm,
    boltGrowthMm,
    interferenceChangeMm,
    stiffnessRatio: kT / k0,
    minPreloadN: p.minN,
    minAtTemperatureN: minAt,
    maxAtTemperatureN: at(p.maxN),
    source: `α and E(T): ASME II-D Tables TE-1, TM-1 [mem] (${bolt.label}; ${rowOf(plates[0].role)!.name})`,
  };
  const total = minAt * n;
  return {
    result,
    reason: null,
    checks: [
      makeCheck({
        id: "flange.thermal.bolt-load",
        title: "Bolt load at design temperature (differential expansion) ≥ Wm1",
        value: total,
        limit: asme.wm1N,
        unit: "N",
        status: total >= asme.wm1N ? "pass" : "fail",
        source: `ASME VIII-1 Appendix 2 Wm1; bolts and members as springs in series [calc]; ${result.source}`,
        note: `At ${T} °C: Δ interference ${interferenceChangeMm.toFixed(3)} mm (plates ${memberGrowthMm.toFixed(3)} mm, bolt ${boltGrowthMm.toFixed(3)} mm), stiffness × ${result.stiffnessRatio.toFixed(3)}; minimum preload ${(p.minN / 1000).toFixed(1)} kN → ${(minAt / 1000).toFixed(1)} kN per bolt, ${n} bolts.`,
      }),
    ],
  };
}
