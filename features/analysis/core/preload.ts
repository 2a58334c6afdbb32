/**
 * Preload target from the design's rule and its scatter by tightening method. Bolt stresses are
 * on the tensile stress area unless said otherwise. Units: N, mm², MPa.
 */
import type { AssemblySettings, PreloadRule } from "./design";
import { getTighteningMethodById } from "./catalogue/tightening-methods";
import { percent } from "./units";

export interface PreloadStrength {
  tensileStressAreaMm2: number;
  rootAreaMm2: number;
  /** Proof stress, or null if the specification defines none (ASTM bolting). */
  proofMpa: number | null;
  yieldMpa: number;
}

/** Proof stress used for proof-based rules: Sp, or 0.9·yield where no proof load is specified [practice]. */
export function effectiveProofMpa(s: PreloadStrength): { proofMpa: number; estimated: boolean } {
  return s.proofMpa !== null
    ? { proofMpa: s.proofMpa, estimated: false }
    : { proofMpa: 0.9 * s.yieldMpa, estimated: true };
}

/**
 * Target preload per bolt. Examples: 0.75 × proof of M20 8.8 (Sp 600 MPa, As 245 mm²) → 110.2 kN;
 * 50 ksi on the root area of 3/4-10 (0.3019 in²) → 67.1 kN.
 */
export function computeTargetPreloadN(
  rule: PreloadRule,
  s: PreloadStrength,
): { targetN: number; note: string } {
  switch (rule.kind) {
    case "fraction-of-proof": {
      const p = effectiveProofMpa(s);
      return {
        targetN: rule.value * p.proofMpa * s.tensileStressAreaMm2,
        note: `${rule.value} × proof load on the tensile stress area${p.estimated ? " (no proof stress in the specification: 0.9 × yield used [practice])" : ""}`,
      };
    }
    case "fraction-of-yield":
      return {
        targetN: rule.value * s.yieldMpa * s.tensileStressAreaMm2,
        note: `${rule.value} × yield on the tensile stress area`,
      };
    case "bolt-stress": {
      const basis = rule.areaBasis ?? "tensile";
      const area = basis === "root" ? s.rootAreaMm2 : s.tensileStressAreaMm2;
      return {
        targetN: rule.value * area,
        note: `${rule.value} MPa on the ${basis === "root" ? "root" : "tensile stress"} area`,
      };
    }
  }
}

/** ± scatter as a fraction: the override, or the midpoint of the method's range. */
export function resolveScatter(assembly: AssemblySettings): { scatter: number; source: string } {
  if (assembly.scatterOverride !== null)
    return { scatter: assembly.scatterOverride, source: "design override" };
  const m = getTighteningMethodById(assembly.method);
  return {
    scatter: m?.scatter ?? 0.3,
    source: m
      ? `${m.name}: ±${percent(m.rangeLow)}–${percent(m.rangeHigh)} % [pub2], midpoint used`
      : "default ±30 %",
  };
}

/** Minimum and maximum preload with scatter. Example: 100 kN ± 30 % → 70 / 130 kN. */
export function applyScatterN(targetN: number, scatter: number): { minN: number; maxN: number } {
  return { minN: targetN * (1 - scatter), maxN: targetN * (1 + scatter) };
}
