import { readFileSync } from "node:fs";
import type { JointDesign } from "@/features/analysis/core/design";

// Design documents of a known weight for the analysis pool's tests (vitest and e2e): the NPS 6
// example flange scaled up and re-bolted. The heavy one sits at the work cap (512 bolts × 128
// samples per pitch = 65,536 path samples, about 8 MB of result, 0.2–0.9 s on this 2-core VM);
// the light one (4 bolts × 8 samples) takes a few milliseconds.
export function exampleDesign(name: string): JointDesign {
  return JSON.parse(readFileSync(`examples/${name}.json`, "utf8")) as JointDesign;
}

export const EXAMPLE_NAMES = [
  "pipe-flange-nps6-spiral-wound",
  "rectangular-cover-full-face",
  "obround-manway",
] as const;

function rebolted(bolts: number, samplesPerPitch: number, scale: number): JointDesign {
  const d = exampleDesign("pipe-flange-nps6-spiral-wound") as unknown as {
    outline: { diameterMm: number };
    bore: { diameterMm: number };
    gasket: { geometry: { innerDiameterMm: number; outerDiameterMm: number } };
    boltPath: { diameterMm: number };
    bolts: { id: string; sMm: number }[];
    estimator: { samplesPerPitch: number };
  };
  d.outline.diameterMm *= scale;
  d.bore.diameterMm *= scale;
  d.gasket.geometry.innerDiameterMm *= scale;
  d.gasket.geometry.outerDiameterMm *= scale;
  d.boltPath.diameterMm *= scale;
  const circumference = Math.PI * d.boltPath.diameterMm;
  d.bolts = Array.from({ length: bolts }, (_, i) => ({
    id: `b${i + 1}`,
    sMm: (circumference / bolts) * (i + 0.5),
  }));
  d.estimator.samplesPerPitch = samplesPerPitch;
  return d as unknown as JointDesign;
}

export const heavyDesign = (): JointDesign => rebolted(512, 128, 40);
export const lightDesign = (): JointDesign => rebolted(4, 8, 1);
