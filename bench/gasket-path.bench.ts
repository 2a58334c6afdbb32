/**
 * FE cross-check, model 2 (gasket path check, Gmsh + CalculiX): wall time of one whole check
 * (mesh, every linear run of the active-set loop, sampling) on this machine. Targets: a
 * circular-pattern sector ≤ 60 s, a 48-bolt rectangular cover ≤ 3 min. Needs /usr/bin/gmsh and
 * /usr/bin/ccx (npm test and npm run bench install them).
 */
import { readFileSync } from "node:fs";
import type { JointDesign } from "@/features/analysis/core/design";
import { runGasketPathCheck, type GasketPathFeResult } from "@/features/fe-check/gasket-path-study";
import { rectangularCover } from "@/tests/features/analysis/core/fixtures";
import { printMedian } from "./measure";

async function medianRun(design: JointDesign, n: number): Promise<{ ms: number; last: GasketPathFeResult }> {
  const times: number[] = [];
  let last: GasketPathFeResult | null = null;
  for (let i = 0; i < n; i++) {
    const t0 = performance.now();
    last = await runGasketPathCheck(design);
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return { ms: times[Math.floor(n / 2)], last: last! };
}

export async function run(): Promise<void> {
  const nps6 = JSON.parse(readFileSync("examples/pipe-flange-nps6-spiral-wound.json", "utf8")) as JointDesign;
  const cases: [string, JointDesign, number][] = [
    ["NPS 6 example, circular-pattern sector", nps6, 3],
    [
      "48-bolt rectangular cover 1200×800, whole plate",
      rectangularCover({ boltCount: 48, widthMm: 1200, heightMm: 800 }),
      1,
    ],
  ];
  for (const [label, design, n] of cases) {
    const { ms, last } = await medianRun(design, n);
    printMedian("gasket-path", label, ms, n);
    console.log(
      `gasket-path:   ${last.modelKind}, ${last.mesh.elements} elements, ${last.linearRuns} linear runs, solver ${last.solverSeconds.toFixed(1)} s`,
    );
  }
}
