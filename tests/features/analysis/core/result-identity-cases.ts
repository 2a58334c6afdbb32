/**
 * The designs whose results must stay the same bit for bit when the core is made faster without a
 * change to its model: the examples, the 96-bolt girth flange (regular and with one bolt dragged),
 * full-face joints that lift off, and the covers of the benchmark. Each case is hashed over every
 * number of `analyzeJoint`, `previewJoint` and a 64 × 64 stress grid, with −0 told apart from 0.
 * `npx tsx tests/features/analysis/core/capture-result-identity.ts` rewrites the fixture (only
 * ever from a core whose results are known good, and saying so in the commit).
 */
import { createHash } from "node:crypto";
import { readFileSync } from "node:fs";
import path from "node:path";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { previewJoint } from "@/features/analysis/core/preview";
import { computeGasketStressGrid } from "@/features/analysis/core/gasket-stress-grid";
import type { JointDesign } from "@/features/analysis/core/design";
import { ELASTOMER_INSERTION, circularFlange, girthFlange96, rectangularCover } from "./fixtures";

const examplesDir = path.join(import.meta.dirname, "../../../../examples");
const example = (name: string) =>
  JSON.parse(readFileSync(path.join(examplesDir, `${name}.json`), "utf8")) as JointDesign;

function dragged(d: JointDesign, index: number, byMm: number): JointDesign {
  d.bolts[index] = { ...d.bolts[index], sMm: d.bolts[index].sMm + byMm };
  return d;
}

export const IDENTITY_CASES: [string, () => JointDesign][] = [
  ["pipe flange NPS 6 example", () => example("pipe-flange-nps6-spiral-wound")],
  ["rectangular full-face cover example", () => example("rectangular-cover-full-face")],
  ["obround manway example", () => example("obround-manway")],
  ["96-bolt girth flange", girthFlange96],
  ["96-bolt girth flange, bolt 4 dragged 7.3 mm", () => dragged(girthFlange96(), 3, 7.3)],
  [
    "96-bolt girth flange, cone estimate, fixed 30° cone",
    () => ({
      ...girthFlange96(),
      estimator: {
        ...girthFlange96().estimator,
        estimator: "cone",
        coneAngle: { mode: "fixed", degrees: 30 },
      },
    }),
  ],
  [
    "8-bolt flange, soft full-face gasket, thin flanges",
    () =>
      circularFlange({
        gasket: "full-face",
        gasketMaterial: ELASTOMER_INSERTION,
        flangeThicknessMm: 12,
        boreMm: 150,
      }),
  ],
  [
    "4-bolt flange, stiff gasket, 6 mm flanges (lift-off)",
    () =>
      circularFlange({
        boltCount: 4,
        flangeThicknessMm: 6,
        gasketMaterial: { ...ELASTOMER_INSERTION, modulusMpa: 20_000 },
      }),
  ],
  [
    "96-bolt girth flange, 6 mm flanges, stiff gasket, bolt 9 dragged (lift-off)",
    () =>
      dragged(
        {
          ...girthFlange96(),
          layers: girthFlange96().layers.map((l) => (l.role === "flange" ? { ...l, thicknessMm: 6 } : l)),
          gasket: { ...girthFlange96().gasket, material: { ...ELASTOMER_INSERTION, modulusMpa: 20_000 } },
        } as JointDesign,
        8,
        20,
      ),
  ],
  ["8-bolt flange, 16 samples per pitch", () => circularFlange({ samplesPerPitch: 16 })],
  ["48-bolt rectangular cover", () => rectangularCover({ boltCount: 48, widthMm: 1200, heightMm: 800 })],
  ["20-bolt rectangular cover, bolt 2 dragged 11 mm", () => dragged(rectangularCover(), 1, 11)],
];

/** SHA-256 of the JSON text of a value, every number written so that −0 and 0 differ. */
export function numbersHash(value: unknown): string {
  const text = JSON.stringify(value, (_k, v: unknown) => {
    if (typeof v === "number" && Object.is(v, -0)) return "-0";
    if (ArrayBuffer.isView(v) && !(v instanceof DataView))
      return Array.from(v as unknown as ArrayLike<number>);
    return v;
  });
  return createHash("sha256").update(text).digest("hex");
}

export interface IdentityRecord {
  analysis: string;
  preview: string;
  grid: string;
  minGasketStressMpa: number;
  maxGasketStressMpa: number;
  beamIterations: number;
}

export function identityOf(make: () => JointDesign): IdentityRecord {
  const a = analyzeJoint(make());
  const grid = computeGasketStressGrid(make(), 64, 64);
  return {
    analysis: numbersHash(a),
    preview: numbersHash(previewJoint(make())),
    grid: numbersHash(grid),
    minGasketStressMpa: a.summary.minGasketStressMpa,
    maxGasketStressMpa: a.summary.maxGasketStressMpa,
    beamIterations: a.gasketStress.beam.iterations,
  };
}

export const IDENTITY_FIXTURE = path.join(import.meta.dirname, "../fixtures/result-identity.json");
