/**
 * The compiled reference of the path estimate (bench/path-estimate.c): compiles it with the
 * system C compiler when there is one, feeds it the same joint as the core, and reads back its
 * median and its numbers so the benchmark can print the ratio and the largest difference.
 */
import { spawnSync } from "node:child_process";
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath } from "node:url";
import type { JointModel } from "@/features/analysis/core/joint-model";
import type { GasketStressProfiles } from "@/features/analysis/core/gasket-stress";

const source = join(dirname(fileURLToPath(import.meta.url)), "path-estimate.c");

export type CReference =
  | { ok: true; medianMs: number; maxAbsDiffMpa: number; maxAbsDiffMm: number; compiler: string }
  | { ok: false; note: string };

function findCompiler(): string | null {
  for (const cc of ["cc", "gcc"]) {
    const r = spawnSync(cc, ["--version"], { encoding: "utf8" });
    if (r.status === 0) return cc;
  }
  return null;
}

/** Runs the C reference `runs` times on the model's path estimate and compares it with `profiles`. */
export function runCReference(
  model: JointModel,
  profiles: GasketStressProfiles,
  forcesN: number[],
  runs: number,
): CReference {
  if (model.region.kind === "full-face")
    return { ok: false, note: "the C reference covers ring gaskets only (no hole test on the path)" };
  const cc = findCompiler();
  if (!cc) return { ok: false, note: "no C compiler (cc or gcc) on this machine: C reference skipped" };
  const dir = mkdtempSync(join(tmpdir(), "sealpitch-bench-c-"));
  try {
    const exe = join(dir, "path-estimate");
    const build = spawnSync(cc, ["-O2", "-ffp-contract=off", "-o", exe, source, "-lm"], { encoding: "utf8" });
    if (build.status !== 0) return { ok: false, note: `${cc} failed: ${build.stderr.trim().slice(0, 300)}` };
    const path = model.region.path;
    const lines: (number | string)[][] = [[runs], [path.segments.length]];
    path.segments.forEach((s, i) => {
      const start = path.segmentStartMm[i];
      lines.push(
        s.kind === "arc"
          ? [1, s.cx, s.cy, s.radiusMm, s.startRad, s.sweepRad, s.lengthMm, start]
          : [0, s.x0, s.y0, s.x1, s.y1, s.lengthMm, start],
      );
    });
    const field = profiles.coneField;
    lines.push([path.lengthMm, path.shiftMm, profiles.sampleCount, profiles.beamInfo.solverNodes]);
    lines.push([
      model.flexuralRigidityNmm2,
      model.foundationModulusMpa,
      model.region.foundationWidthMm,
      model.region.holeRadiusMm,
      model.coneRadiusMm,
      model.footprintShape.a,
      model.footprintShape.b,
    ]);
    const bolts = model.region.bolts;
    lines.push([bolts.length]);
    bolts.forEach((b, i) => {
      if (b.x !== model.boltPoints[i].x || b.y !== model.boltPoints[i].y)
        throw new Error("C reference: the gasket region's bolts differ from the model's");
      lines.push([b.x, b.y, forcesN[i], field.onGasketFraction[i]]);
    });
    const input = join(dir, "input.txt");
    const output = join(dir, "output.txt");
    // String(number) is the shortest text that reads back to the same double (strtod in C).
    writeFileSync(input, lines.map((l) => l.map(String).join(" ")).join("\n") + "\n");
    const run = spawnSync(exe, [input, output], { encoding: "utf8" });
    if (run.status !== 0) return { ok: false, note: `C reference failed: ${run.stderr.trim()}` };
    const medianMs = Number(/median_ms (\S+)/.exec(run.stdout)?.[1]);
    const rows = readFileSync(output, "utf8")
      .trim()
      .split("\n")
      .map((l) => l.split(" ").map(Number));
    let dMpa = 0;
    let dMm = 0;
    const sums = [profiles.cone, profiles.beam];
    sums.forEach((s, k) => {
      const [min, max, mean, minS, maxS, unloaded] = rows[k];
      dMpa = Math.max(dMpa, Math.abs(min - s.minMpa), Math.abs(max - s.maxMpa), Math.abs(mean - s.meanMpa));
      dMm = Math.max(
        dMm,
        Math.abs(minS - s.minAt.sMm),
        Math.abs(maxS - s.maxAt.sMm),
        Math.abs(unloaded - s.unloadedLengthMm),
      );
    });
    const [, lifted, iterations] = rows[2];
    dMm = Math.max(dMm, Math.abs(lifted - profiles.beamInfo.liftedLengthMm));
    if (iterations !== profiles.beamInfo.iterations) dMm = Infinity;
    for (let j = 0; j < profiles.sampleCount; j++) {
      const [x, y, cone, beam] = rows[3 + j];
      dMm = Math.max(dMm, Math.abs(x - profiles.xMm[j]), Math.abs(y - profiles.yMm[j]));
      dMpa = Math.max(dMpa, Math.abs(cone - profiles.coneMpa[j]), Math.abs(beam - profiles.beamMpa[j]));
    }
    return { ok: true, medianMs, maxAbsDiffMpa: dMpa, maxAbsDiffMm: dMm, compiler: cc };
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
