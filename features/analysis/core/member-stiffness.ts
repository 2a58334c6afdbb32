/**
 * Stiffness of the clamped members by pressure-cone frusta (the pressure-cone model of VDI 2230
 * Part 1; the frustum integral [calc]): two cones grow from the bearing faces and meet at
 * mid-grip; where a cone crosses a layer boundary it is split into frusta with the diameter
 * reached at that depth; 1/km = Σ 1/ki. Units: mm, MPa, N/mm. The hole diameter dh and the
 * bearing diameter D are the real ones (washer OD, or ≈ 1.5·d for a nut face).
 */
import * as fm from "./fixed-math";

export interface FrustumResult {
  layerIndex: number;
  thicknessMm: number;
  narrowDiameterMm: number;
  modulusMpa: number;
  stiffnessNPerMm: number;
}

/**
 * k = π·E·d·tanα / ln{[(2t·tanα + D − d)(D + d)] / [(2t·tanα + D + d)(D − d)]}, D the diameter at
 * the narrow end. Example: E = 90 GPa, t = 25, D = 27, d = 18, α = 45° → 4.4916e6 N/mm.
 */
export function frustumStiffnessNPerMm(
  modulusMpa: number,
  thicknessMm: number,
  narrowDiameterMm: number,
  holeDiameterMm: number,
  coneAngleDeg: number,
): number {
  const tan = fm.tan((coneAngleDeg * Math.PI) / 180);
  const D = narrowDiameterMm;
  const d = holeDiameterMm;
  const a = 2 * thicknessMm * tan;
  const ratio = ((a + D - d) * (D + d)) / ((a + D + d) * (D - d));
  return (Math.PI * modulusMpa * d * tan) / fm.log(ratio);
}

/**
 * Member stiffness of a stack (layers top to bottom, each {thicknessMm, modulusMpa}).
 * Example (Jindal Ex. 31-1): two 25 mm layers of 90 GPa, D = 27, d = 18, 45° → 2.2458e6 N/mm;
 * at 30° → 1.5609e6 N/mm.
 */
export function computeMemberStiffness(input: {
  layers: { thicknessMm: number; modulusMpa: number }[];
  bearingDiameterMm: number;
  holeDiameterMm: number;
  coneAngleDeg: number;
}): { stiffnessNPerMm: number; frusta: FrustumResult[] } {
  const total = input.layers.reduce((a, l) => a + l.thicknessMm, 0);
  const mid = total / 2;
  const tan = fm.tan((input.coneAngleDeg * Math.PI) / 180);
  const frusta: FrustumResult[] = [];
  let z = 0;
  input.layers.forEach((layer, i) => {
    const top = z;
    const bottom = z + layer.thicknessMm;
    z = bottom;
    // Part above mid-grip: cone from the top face; part below: cone from the bottom face.
    const pieces: [number, number][] = [];
    if (top < mid) pieces.push([top, Math.min(bottom, mid)]);
    if (bottom > mid) pieces.push([Math.max(top, mid), bottom]);
    for (const [a, b] of pieces) {
      const t = b - a;
      if (t <= 1e-12) continue;
      const depthNarrow = a < mid ? a : total - b;
      const D = input.bearingDiameterMm + 2 * depthNarrow * tan;
      frusta.push({
        layerIndex: i,
        thicknessMm: t,
        narrowDiameterMm: D,
        modulusMpa: layer.modulusMpa,
        stiffnessNPerMm: frustumStiffnessNPerMm(
          layer.modulusMpa,
          t,
          D,
          input.holeDiameterMm,
          input.coneAngleDeg,
        ),
      });
    }
  });
  const flex = frusta.reduce((a, f) => a + 1 / f.stiffnessNPerMm, 0);
  return { stiffnessNPerMm: 1 / flex, frusta };
}

/**
 * FE correction of the frusta (calibrated with the real hole and bearing and the thickness-dependent
 * substitute cone): km_FE/km_frusta = s0 + s1·L + s2·L², L = ln(grip/(2d)) within ln 0.5…ln 4
 * (catalogue/interface-calibration.ts). Example: grip = 2d → s0.
 */
export function frustumCorrection(gripMm: number, nominalDiameterMm: number, s: readonly number[]): number {
  const L = fm.log(Math.min(Math.max(gripMm / (2 * nominalDiameterMm), 0.5), 4));
  return s[0] + s[1] * L + s[2] * L * L;
}

/** Wileman, Choudury & Green (1991) fit constants A, B [mem: as commonly tabulated]. */
export const WILEMAN_CONSTANTS = {
  steel: { a: 0.78715, b: 0.62873 },
  aluminium: { a: 0.7967, b: 0.63816 },
  copper: { a: 0.79568, b: 0.63553 },
  "grey-cast-iron": { a: 0.77871, b: 0.61616 },
} as const;

/**
 * Cross-check for two members of one material: km = E·d·A·exp(B·d/l).
 * Example: steel 207 GPa, d = 16, l = 40 → about 3.35e6 N/mm (the 30° cone gives 3.33e6: within 1 %).
 */
export function wilemanMemberStiffnessNPerMm(
  modulusMpa: number,
  diameterMm: number,
  gripMm: number,
  material: keyof typeof WILEMAN_CONSTANTS = "steel",
): number {
  const c = WILEMAN_CONSTANTS[material];
  return modulusMpa * diameterMm * c.a * fm.exp((c.b * diameterMm) / gripMm);
}
