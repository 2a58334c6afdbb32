/**
 * FE cross-check (Gmsh + CalculiX): wall time of each model on this machine, for every example
 * design and a 48-bolt rectangular cover, and what it says against the estimate (the rows of the
 * README's "Estimate against FE" table). Model 1, the axisymmetric bolt stack (target ≤ 10 s);
 * model 2, the gasket path check (targets: circular-pattern sector ≤ 60 s, 48-bolt rectangular
 * cover ≤ 3 min). Needs /usr/bin/gmsh and /usr/bin/ccx (npm test and npm run bench install them).
 */
import { readFileSync } from "node:fs";
import { loadavg } from "node:os";
import type { JointDesign } from "@/features/analysis/core/design";
import { buildJointModel } from "@/features/analysis/core/joint-model";
import { runGasketPathCheck, type GasketPathFeResult } from "@/features/fe-check/gasket-path-study";
import { runStackCheck, type StackCheckResult } from "@/features/fe-check/joint-stack";
import { solveStack } from "@/features/fe-check/stack-study";
import { rectangularCover } from "@/tests/features/analysis/core/fixtures";
import { printMedian } from "./measure";
import { figure, formatMs } from "./report";

async function median<T>(n: number, once: () => Promise<T>): Promise<{ ms: number; last: T }> {
  const times: number[] = [];
  let last: T | undefined;
  for (let i = 0; i < n; i++) {
    const t0 = performance.now();
    last = await once();
    times.push(performance.now() - t0);
  }
  times.sort((a, b) => a - b);
  return { ms: times[Math.floor(n / 2)], last: last as T };
}

const pct = (est: number, fe: number) => `${(((fe - est) / est) * 100).toFixed(1)} %`;

function example(name: string): JointDesign {
  return JSON.parse(readFileSync(`examples/${name}.json`, "utf8")) as JointDesign;
}

export async function run(): Promise<void> {
  // [printed label, design, runs, the README table's row label]
  const cases: [string, JointDesign, number, string][] = [
    ["NPS 6 example (spiral wound)", example("pipe-flange-nps6-spiral-wound"), 3, "NPS 6 example"],
    ["obround manway example", example("obround-manway"), 1, "obround manway example"],
    [
      "rectangular cover example (full face)",
      example("rectangular-cover-full-face"),
      1,
      "rectangular cover example (full face)",
    ],
    [
      "48-bolt rectangular cover 1200×800",
      rectangularCover({ boltCount: 48, widthMm: 1200, heightMm: 800 }),
      1,
      "48-bolt rectangular cover 1200 × 800",
    ],
  ];
  for (const [label, design, n, row] of cases) {
    let rounds = 0;
    const stack = await median<StackCheckResult>(n, () =>
      runStackCheck(buildJointModel(design), async (spec, forceN, hooks) => {
        const study = await solveStack(spec, forceN, hooks);
        rounds = study.solverRounds;
        return study;
      }),
    );
    printMedian("fe-check", `${label}, bolt stack`, stack.ms, n);
    const s = stack.last;
    console.log(
      `fe-check:   ${s.elements} elements, ${s.linearRuns} linear runs in ${rounds} rounds (load ${loadavg()[0].toFixed(1)}); loaded radius ${s.estimate.loadedRadiusMm.toFixed(1)} → ${s.fe.loadedRadiusMm.toFixed(1)} mm (${pct(s.estimate.loadedRadiusMm, s.fe.loadedRadiusMm)}), stiffness ${pct(s.estimate.memberStiffnessNPerMm, s.fe.memberStiffnessNPerMm)}, peak ${pct(s.estimate.peakMpa, s.fe.peakMpa)}`,
    );
    figure(
      `FE bolt stack: ${row}`,
      `${formatMs(stack.ms)}${n > 1 ? ` (median of ${n})` : ""}, ${stack.last.linearRuns} runs in ${rounds} rounds, load ${loadavg()[0].toFixed(1)}`,
      {
        goal: "≤ 10 s",
      },
    );
    const path = await median<GasketPathFeResult>(n, () => runGasketPathCheck(design));
    printMedian("fe-check", `${label}, gasket path`, path.ms, n);
    const p = path.last;
    console.log(
      `fe-check:   ${p.modelKind}, ${p.mesh.elements} elements, ${p.linearRuns} linear runs, solver ${p.solverSeconds.toFixed(1)} s; min/max ${p.estimate.minMpa.toFixed(2)}/${p.estimate.maxMpa.toFixed(2)} MPa (${p.estimate.estimator}) → FE ${p.fe.minMpa.toFixed(2)}/${p.fe.maxMpa.toFixed(2)} MPa, lifted ${p.estimate.liftedLengthMm.toFixed(0)} → ${p.fe.liftedLengthMm.toFixed(0)} mm`,
    );
    figure(
      `FE gasket path: ${row}`,
      `${formatMs(path.ms)} (${p.modelKind}, ${p.mesh.elements} elements, solver ${p.solverSeconds.toFixed(1)} s)`,
      row.startsWith("48-bolt")
        ? { goal: "≤ 3 min" }
        : p.modelKind === "circular-sector"
          ? { goal: "≤ 60 s" }
          : {},
    );
  }
}
