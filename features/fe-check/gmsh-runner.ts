/**
 * Runs Gmsh (`/usr/bin/gmsh`, Debian package gmsh) on one `.geo` file in a fresh temporary folder,
 * one thread, and returns the 2D mesh as MSH 2.2 text. A run counts only when Gmsh exits with 0,
 * printed no error (Gmsh 4.8 exits with 0 after errors in a .geo and writes what it could) and
 * wrote the mesh. Killed past its time limit (CcxError) or when the signal aborts (CcxCancelled);
 * the folder is always removed. Server-side only.
 */
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { CcxCancelled, CcxError, runKillable } from "./ccx-runner";

export const GMSH_PATH = "/usr/bin/gmsh";

export async function runGmshAsync(
  geo: string,
  opts: { timeoutMs?: number; signal?: AbortSignal } = {},
): Promise<string> {
  if (opts.signal?.aborted) throw new CcxCancelled();
  const timeoutMs = opts.timeoutMs ?? 120_000;
  const dir = mkdtempSync(join(tmpdir(), "sealpitch-gmsh-"));
  try {
    writeFileSync(join(dir, "plate.geo"), geo);
    const { out, status, reason } = await runKillable(
      GMSH_PATH,
      ["-2", "plate.geo", "-o", "plate.msh", "-format", "msh22", "-nt", "1"],
      {
        cwd: dir,
        env: { OMP_NUM_THREADS: "1", HOME: dir } as unknown as NodeJS.ProcessEnv,
        timeoutMs,
        signal: opts.signal,
      },
    );
    if (reason === "cancelled") throw new CcxCancelled();
    if (reason === "timeout")
      throw new CcxError(`Gmsh ran past its time limit of ${Math.round(timeoutMs / 1000)} s`, out);
    if (reason instanceof Error) throw new CcxError(`could not run ${GMSH_PATH}: ${reason.message}`, out);
    const err = /^Error\s*:[^\n]*/m.exec(out);
    if (err || status !== 0 || !existsSync(join(dir, "plate.msh")))
      throw new CcxError(
        `Gmsh could not mesh the plate (${err ? err[0].trim() : `exit status ${status}`})`,
        out,
      );
    return readFileSync(join(dir, "plate.msh"), "utf8");
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
}
