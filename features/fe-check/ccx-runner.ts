/**
 * Runs CalculiX (`/usr/bin/ccx`, Debian package calculix-ccx) on one deck in a fresh temporary
 * folder with OMP_NUM_THREADS=1 and returns the `.dat` text. The exit code is not trusted alone:
 * a run counts as finished only when the `.sta` file records an increment of step 1 reaching
 * the step's total time, stdout shows no *ERROR, and the `.dat` file exists. Server-side only
 * (spawns a process); the deck writer and the parser are pure.
 */
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";

/** Where Debian's calculix-ccx installs the solver. */
export const CCX_PATH = "/usr/bin/ccx";

export class CcxError extends Error {
  constructor(
    message: string,
    readonly output: string,
  ) {
    super(message);
    this.name = "CcxError";
  }
}

/** True when `.sta` shows a finished increment of the step ending at step time 1. */
export function staShowsFinishedStep(sta: string): boolean {
  const rows = sta
    .split(/\r?\n/)
    .map((l) => l.trim().split(/\s+/).map(Number))
    .filter((r) => r.length >= 7 && r.every(Number.isFinite));
  return rows.some((r) => Math.abs(r[5] - 1) < 1e-6);
}

export function runCcx(deck: string, opts: { timeoutMs?: number; keepDir?: boolean } = {}): string {
  const dir = mkdtempSync(join(tmpdir(), "sealpitch-ccx-"));
  try {
    writeFileSync(join(dir, "job.inp"), deck);
    const res = spawnSync(CCX_PATH, ["-i", "job"], {
      cwd: dir,
      env: { OMP_NUM_THREADS: "1", CCX_NPROC_EQUATION_SOLVER: "1" } as unknown as NodeJS.ProcessEnv,
      encoding: "utf8",
      timeout: opts.timeoutMs ?? 120_000,
      maxBuffer: 64 * 1024 * 1024,
    });
    const out = `${res.stdout ?? ""}${res.stderr ?? ""}`;
    if (res.error) throw new CcxError(`could not run ${CCX_PATH}: ${res.error.message}`, out);
    const err = /\*ERROR[^\n]*/.exec(out);
    if (err) throw new CcxError(`CalculiX reported: ${err[0].trim()}`, out);
    const sta = existsSync(join(dir, "job.sta")) ? readFileSync(join(dir, "job.sta"), "utf8") : "";
    if (!staShowsFinishedStep(sta)) throw new CcxError("CalculiX did not finish the step (job.sta)", out);
    const datPath = join(dir, "job.dat");
    if (!existsSync(datPath)) throw new CcxError("CalculiX wrote no job.dat", out);
    if (res.status !== 0) throw new CcxError(`CalculiX exited with status ${res.status}`, out);
    return readFileSync(datPath, "utf8");
  } finally {
    if (!opts.keepDir) rmSync(dir, { recursive: true, force: true });
  }
}
