/**
 * Runs CalculiX (`/usr/bin/ccx`, Debian package calculix-ccx) on one deck in a fresh temporary
 * folder with OMP_NUM_THREADS=1 and returns the `.dat` text. The exit code is not trusted alone:
 * a run counts as finished only when the `.sta` file records an increment of step 1 reaching
 * the step's total time, stdout shows no *ERROR, and the `.dat` file exists. Server-side only
 * (spawns a process); the deck writer and the parser are pure.
 */
import { spawn, spawnSync } from "node:child_process";
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

/** The run was cancelled through its AbortSignal (the solver process was killed). */
export class CcxCancelled extends Error {
  constructor() {
    super("The FE run was cancelled.");
    this.name = "CcxCancelled";
  }
}

// A clean environment: one thread. NODE_ENV only because Next's types require it in every
// environment; CalculiX does not read it.
const CCX_ENV: NodeJS.ProcessEnv = {
  OMP_NUM_THREADS: "1",
  CCX_NPROC_EQUATION_SOLVER: "1",
  NODE_ENV: "production",
};
const DEFAULT_TIMEOUT_MS = 120_000;

/** Checks a finished process's output and folder; returns the `.dat` text. */
function readRun(dir: string, out: string, status: number | null): string {
  const err = /\*ERROR[^\n]*/.exec(out);
  if (err) throw new CcxError(`CalculiX reported: ${err[0].trim()}`, out);
  const sta = existsSync(join(dir, "job.sta")) ? readFileSync(join(dir, "job.sta"), "utf8") : "";
  if (!staShowsFinishedStep(sta)) throw new CcxError("CalculiX did not finish the step (job.sta)", out);
  const datPath = join(dir, "job.dat");
  if (!existsSync(datPath)) throw new CcxError("CalculiX wrote no job.dat", out);
  if (status !== 0) throw new CcxError(`CalculiX exited with status ${status}`, out);
  return readFileSync(datPath, "utf8");
}

function deckFolder(deck: string): string {
  const dir = mkdtempSync(join(tmpdir(), "sealpitch-ccx-"));
  writeFileSync(join(dir, "job.inp"), deck);
  return dir;
}

/** Blocking run (scripts and calibration; a server request or job uses runCcxAsync). */
export function runCcx(deck: string, opts: { timeoutMs?: number; keepDir?: boolean } = {}): string {
  const dir = deckFolder(deck);
  try {
    const res = spawnSync(CCX_PATH, ["-i", "job"], {
      cwd: dir,
      env: CCX_ENV,
      encoding: "utf8",
      timeout: opts.timeoutMs ?? DEFAULT_TIMEOUT_MS,
      maxBuffer: 64 * 1024 * 1024,
    });
    const out = `${res.stdout ?? ""}${res.stderr ?? ""}`;
    if (res.error) throw new CcxError(`could not run ${CCX_PATH}: ${res.error.message}`, out);
    return readRun(dir, out, res.status);
  } finally {
    if (!opts.keepDir) rmSync(dir, { recursive: true, force: true });
  }
}

export type KillableOutcome = {
  out: string;
  status: number | null;
  reason: "exit" | "timeout" | "cancelled" | Error;
};

/** A child process off the event loop, killed (SIGKILL) past `timeoutMs` or when `signal` aborts; never rejects. */
export function runKillable(
  command: string,
  args: string[],
  opts: { cwd: string; env: NodeJS.ProcessEnv; timeoutMs: number; signal?: AbortSignal },
): Promise<KillableOutcome> {
  return new Promise((resolve) => {
    const child = spawn(command, args, { cwd: opts.cwd, env: opts.env, stdio: ["ignore", "pipe", "pipe"] });
    const chunks: string[] = [];
    let reason: KillableOutcome["reason"] = "exit";
    child.stdout.setEncoding("utf8").on("data", (c: string) => chunks.push(c));
    child.stderr.setEncoding("utf8").on("data", (c: string) => chunks.push(c));
    const stop = (why: "timeout" | "cancelled") => {
      reason = why;
      child.kill("SIGKILL");
    };
    const timer = setTimeout(() => stop("timeout"), opts.timeoutMs);
    const onAbort = () => stop("cancelled");
    opts.signal?.addEventListener("abort", onAbort, { once: true });
    child.on("error", (error) => {
      reason = error;
    });
    child.on("close", (code) => {
      clearTimeout(timer);
      opts.signal?.removeEventListener("abort", onAbort);
      resolve({ out: chunks.join(""), status: code, reason });
    });
  });
}

/**
 * The same run without blocking the event loop: the solver is a child process, killed when the
 * time limit passes (CcxError) or the signal aborts (CcxCancelled). The folder is always removed.
 */
export async function runCcxAsync(
  deck: string,
  opts: { timeoutMs?: number; signal?: AbortSignal } = {},
): Promise<string> {
  if (opts.signal?.aborted) throw new CcxCancelled();
  const dir = deckFolder(deck);
  try {
    const { out, status, reason } = await runKillable(CCX_PATH, ["-i", "job"], {
      cwd: dir,
      env: CCX_ENV,
      timeoutMs: opts.timeoutMs ?? DEFAULT_TIMEOUT_MS,
      signal: opts.signal,
    });
    if (reason === "cancelled") throw new CcxCancelled();
    if (reason === "timeout")
      throw new CcxError(
        `CalculiX ran past its time limit of ${Math.round((opts.timeoutMs ?? DEFAULT_TIMEOUT_MS) / 1000)} s`,
        out,
      );
    if (reason instanceof Error) throw new CcxError(`could not run ${CCX_PATH}: ${reason.message}`, out);
    return readRun(dir, out, status);
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
