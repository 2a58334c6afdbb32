import "server-only";
import type { UnitSystem } from "@/features/analysis/core/design";
import { mmToIn, mpaToPsi, nToLbf, nmmToFtLb, nmmToNm } from "@/features/analysis/core/units";

/**
 * Display helpers for the sheet: numbers without their unit (tables name the unit in the header),
 * in the viewer's unit system. Decimals follow shop practice: 0.1 mm / 0.001 in, whole MPa / psi.
 */
export interface SheetUnits {
  system: UnitSystem;
  length: string;
  stress: string;
  force: string;
  torque: string;
  len(mm: number): string;
  stress1(mpa: number): string;
  force1(n: number): string;
  torque1(nmm: number): string;
  /** Converters for charts. */
  lenValue(mm: number): number;
  stressValue(mpa: number): number;
}

const num = (v: number, decimals: number): string => {
  const s = v.toFixed(decimals);
  return /^-0\.?0*$/.test(s) ? s.slice(1) : s;
};

export function sheetUnits(system: UnitSystem): SheetUnits {
  if (system === "US") {
    return {
      system,
      length: "in",
      stress: "psi",
      force: "lbf",
      torque: "ft·lb",
      len: (mm) => num(mmToIn(mm), 3),
      stress1: (mpa) => num(mpaToPsi(mpa), 0),
      force1: (n) => num(nToLbf(n), 0),
      torque1: (nmm) => num(nmmToFtLb(nmm), 0),
      lenValue: mmToIn,
      stressValue: mpaToPsi,
    };
  }
  return {
    system,
    length: "mm",
    stress: "MPa",
    force: "kN",
    torque: "N·m",
    len: (mm) => num(mm, 1),
    stress1: (mpa) => num(mpa, mpa < 10 ? 2 : 1),
    force1: (n) => num(n / 1000, 1),
    torque1: (nmm) => num(nmmToNm(nmm), 0),
    lenValue: (mm) => mm,
    stressValue: (mpa) => mpa,
  };
}

export function angle(deg: number): string {
  return num(deg, 2);
}
