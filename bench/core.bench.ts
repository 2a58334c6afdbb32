/**
 * Core benchmarks: the path estimate (both estimators) must stay well inside a 60 fps frame
 * while a bolt is dragged (target ≤ 2 ms on the 2-core machine), the 256 × 256 heat map ≤ 30 ms.
 * The 96-bolt path estimate also runs as compiled C (bench/path-estimate.c, the same arithmetic)
 * in the same invocation: the goal is the core within 3× of it, and the two must agree.
 */
import { buildJointModel } from "@/features/analysis/core/joint-model";
import { computeGasketStressProfiles } from "@/features/analysis/core/gasket-stress";
import { computeGasketStressGrid } from "@/features/analysis/core/gasket-stress-grid";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import { previewJoint } from "@/features/analysis/core/preview";
import type { JointDesign } from "@/features/analysis/core/design";
import { girthFlange96, rectangularCover } from "@/tests/features/analysis/core/fixtures";
import { medianMs, printMedian } from "./measure";
import { runCReference } from "./c-reference";

export async function run(): Promise<void> {
  const girth = girthFlange96();
  const rect = rectangularCover({ boltCount: 48, widthMm: 1200, heightMm: 800 });
  // A drag: one bolt moves a little every frame (the regular-pattern shortcut no longer applies).
  const frames: JointDesign[] = Array.from({ length: 16 }, (_, k) => {
    const d = structuredClone(girth);
    d.bolts[3] = { ...d.bolts[3], sMm: d.bolts[3].sMm + 0.5 + 0.37 * k };
    return d;
  });
  let f = 0;
  const cases: [string, () => unknown, number][] = [
    [
      "96-bolt circle path (both estimators, 64/pitch)",
      () => computeGasketStressProfiles(buildJointModel(girth)),
      200,
    ],
    ["96-bolt circle 256×256 grid", () => computeGasketStressGrid(girth, 256, 256), 50],
    [
      "48-bolt rectangular cover path (both, 64/pitch)",
      () => computeGasketStressProfiles(buildJointModel(rect)),
      200,
    ],
    [
      "48-bolt rectangular cover 256×256 grid (cone)",
      () => computeGasketStressGrid(rect, 256, 256, { estimator: "cone" }),
      50,
    ],
    ["96-bolt circle analyzeJoint (everything)", () => analyzeJoint(girth), 30],
    ["96-bolt circle previewJoint (drag preview)", () => previewJoint(girth), 200],
    ["96-bolt circle previewJoint, one bolt dragged", () => previewJoint(frames[f++ % frames.length]), 200],
  ];
  for (const [label, fn, n] of cases) printMedian("core", label, medianMs(fn, n), n);

  // The path estimate alone (model built once, as while a drag re-runs it) against compiled C.
  const model = buildJointModel(girth);
  const profiles = computeGasketStressProfiles(model);
  const runs = 400;
  const core = medianMs(() => computeGasketStressProfiles(model), runs);
  printMedian("core", "96-bolt path estimate alone (model built)", core, runs);
  const c = runCReference(
    model,
    profiles,
    model.boltPoints.map(() => model.preload.targetN),
    runs,
  );
  if (!c.ok) {
    console.log(`core: C reference skipped: ${c.note}`);
    return;
  }
  printMedian("core", `same arithmetic in C (${c.compiler} -O2)`, c.medianMs, runs);
  console.log(
    `core: path estimate core / C = ${(core / c.medianMs).toFixed(2)}× (goal ≤ 3×); max |core − C| ${c.maxAbsDiffMpa.toExponential(1)} MPa, ${c.maxAbsDiffMm.toExponential(1)} mm over ${profiles.sampleCount} samples`,
  );
}
