/**
 * Quads of the gasket-stress heat map along the gasket path: one strip across the gasket width
 * per profile sample, coloured by the stress there. Cheap enough to rebuild every drag frame
 * (a few thousand quads for 96 bolts). Model coordinates, mm.
 */
import type { JointDesign } from "@/features/analysis/core/design";
import { buildGasketRegion } from "@/features/analysis/core/gasket-region";
import { pointAtArcLength } from "@/features/analysis/core/path";

export interface HeatQuad { x: number[]; y: number[]; stressMpa: number }

/** Width across the path of the coloured band, mm. */
function bandWidthMm(design: JointDesign, region: ReturnType<typeof buildGasketRegion>): number {
  if (region.kind === "annulus") return region.outerRadiusMm - region.innerRadiusMm;
  if (region.kind === "band") return region.bandWidthMm;
  // Full face: the strip either side of the bolt path where neighbouring bolts must overlap.
  return Math.min(region.stripWidthMm, 3 * design.fastener.holeDiameterMm);
}

export function buildHeatQuads(design: JointDesign, sMm: number[], stressMpa: number[]): HeatQuad[] {
  if (sMm.length < 2) return [];
  const region = buildGasketRegion(design);
  const hw = bandWidthMm(design, region) / 2;
  const L = region.path.lengthMm;
  const quads: HeatQuad[] = [];
  const edge = (s: number) => {
    const q = pointAtArcLength(region.path, s);
    const nx = -q.ty, ny = q.tx;
    return { ox: q.x + nx * hw, oy: q.y + ny * hw, ix: q.x - nx * hw, iy: q.y - ny * hw };
  };
  const n = sMm.length;
  for (let i = 0; i < n; i++) {
    const s0 = i === 0 ? (sMm[0] + sMm[n - 1] - L) / 2 : (sMm[i - 1] + sMm[i]) / 2;
    const s1 = i === n - 1 ? (sMm[n - 1] + sMm[0] + L) / 2 : (sMm[i] + sMm[i + 1]) / 2;
    const a = edge(s0);
    const b = edge(s1);
    quads.push({ x: [a.ox, b.ox, b.ix, a.ix], y: [a.oy, b.oy, b.iy, a.iy], stressMpa: stressMpa[i] });
  }
  return quads;
}
