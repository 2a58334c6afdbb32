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
import { figure, formatMs } from "./report";

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
  // [printed label, work, runs, the README table's row, its goal]
  const cases: [string, () => unknown, number, string, string?][] = [
    [
      "96-bolt circle path (both estimators, 64/pitch)",
      () => computeGasketStressProfiles(buildJointModel(girth)),
      200,
      "Core: 96-bolt path estimate with its joint model (both estimators, 64 samples per pitch)",
      "≤ 2 ms",
    ],
    [
      "96-bolt circle 256×256 grid",
      () => computeGasketStressGrid(girth, 256, 256),
      50,
      "Core: 96-bolt 256 × 256 grid",
      "≤ 30 ms",
    ],
    [
      "48-bolt rectangular cover path (both, 64/pitch)",
      () => computeGasketStressProfiles(buildJointModel(rect)),
      200,
      "Core: 48-bolt rectangular cover path (both estimators, 64 samples per pitch)",
    ],
    [
      "48-bolt rectangular cover 256×256 grid (cone)",
      () => computeGasketStressGrid(rect, 256, 256, { estimator: "cone" }),
      50,
      "Core: 48-bolt rectangular cover 256 × 256 grid (cone)",
      "≤ 30 ms",
    ],
    [
      "96-bolt circle analyzeJoint (everything)",
      () => analyzeJoint(girth),
      30,
      "Core: 96-bolt analyzeJoint (everything)",
    ],
    [
      "96-bolt circle previewJoint (drag preview)",
      () => previewJoint(girth),
      200,
      "Core: 96-bolt previewJoint (drag preview)",
    ],
    [
      "96-bolt circle previewJoint, one bolt dragged",
      () => previewJoint(frames[f++ % frames.length]),
      200,
      "Core: 96-bolt previewJoint, one bolt dragged",
    ],
  ];
  for (const [label, fn, n, row, goal] of cases) {
    const ms = medianMs(fn, n);
    printMedian("core", label, ms, n);
    figure(row, `${formatMs(ms)} (median of ${n})`, goal ? { goal } : {});
  }

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
  const cRow = "Core: 96-bolt path estimate alone (model built) against the same arithmetic in C";
  if (!c.ok) {
    console.log(`core: C reference skipped: ${c.note}`);
    figure(cRow, `${formatMs(core)} (median of ${runs})`, { goal: "≤ 3× C", ratio: `C skipped: ${c.note}` });
    return;
  }
  printMedian("core", `same arithmetic in C (${c.compiler} -O2)`, c.medianMs, runs);
  console.log(
    `core: path estimate core / C = ${(core / c.medianMs).toFixed(2)}× (goal ≤ 3×); max |core − C| ${c.maxAbsDiffMpa.toExponential(1)} MPa, ${c.maxAbsDiffMm.toExponential(1)} mm over ${profiles.sampleCount} samples`,
  );
  figure(cRow, `${formatMs(core)}; C (${c.compiler} -O2) ${formatMs(c.medianMs)} (medians of ${runs})`, {
    goal: "≤ 3× C",
    ratio: `${(core / c.medianMs).toFixed(2)}× C; largest difference ${c.maxAbsDiffMpa === 0 && c.maxAbsDiffMm === 0 ? "0 (the same bits)" : `${c.maxAbsDiffMpa.toExponential(1)} MPa, ${c.maxAbsDiffMm.toExponential(1)} mm`}`,
  });
}
