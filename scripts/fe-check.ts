/**
 * Command line: `npm run fe-check -- design.json` runs the FE cross-check of a design document on
 * CalculiX (as the app's job does) and prints the FeCheckResult as JSON on stdout, with progress
 * and the estimate-against-FE table on stderr. `--time-limit S` sets the wall-time limit in
 * seconds (default 600). Exit codes: 0 done, 1 invalid design or a run that could not finish,
 * 2 usage.
 */
import { readFileSync } from "node:fs";
import { formatDesignErrors, jointDesignSchema } from "@/features/analysis/schema";
import type { JointDesign } from "@/features/analysis/core/design";
import { FE_DEFAULT_TIME_LIMIT_MS, runFeCheck } from "@/features/fe-check/run-fe-check";
import { formatComparisonTable } from "@/features/fe-check/comparison-text";

function fail(lines: string[], code = 1): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(code);
}

async function main(argv: string[]): Promise<void> {
  const args = argv.filter((a) => a !== "--");
  const usage = "usage: npm run fe-check -- <design.json> [--time-limit seconds]";
  let timeLimitMs = FE_DEFAULT_TIME_LIMIT_MS;
  const li = args.indexOf("--time-limit");
  if (li >= 0) {
    const s = Number(args[li + 1]);
    if (!(s > 0)) fail([usage], 2);
    timeLimitMs = s * 1000;
    args.splice(li, 2);
  }
  const file = args[0];
  if (!file || args.length > 1) fail([usage], 2);
  let raw: unknown;
  try {
    raw = JSON.parse(readFileSync(file, "utf8"));
  } catch (e) {
    fail([
      `${file}: ${(e as NodeJS.ErrnoException).code ? "cannot read file" : `not valid JSON (${(e as Error).message})`}`,
    ]);
  }
  const parsed = jointDesignSchema.safeParse(raw);
  if (!parsed.success)
    fail([`${file}: invalid design`, ...formatDesignErrors(parsed.error).map((l) => `  ${l}`)]);
  const abort = new AbortController();
  process.once("SIGINT", () => abort.abort());
  try {
    const result = await runFeCheck(parsed.data as JointDesign, {
      signal: abort.signal,
      timeLimitMs,
      onProgress: (stage, p) =>
        void process.stderr.write(
          `${stage} (${p.elements} elements, ${p.solverSeconds.toFixed(1)} s in the solver)\n`,
        ),
    });
    process.stderr.write(`${formatComparisonTable(result)}\n`);
    process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
  } catch (error) {
    fail([`${file}: ${error instanceof Error ? error.message : String(error)}`]);
  }
}

void main(process.argv.slice(2));
