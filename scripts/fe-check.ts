/**
 * Command line: `npm run fe-check -- design.json` runs the FE cross-check of a design document on
 * CalculiX (as the app's job does) and prints the FeCheckResult as JSON on stdout, with progress
 * and the estimate-against-FE table on stderr. `--time-limit S` sets the wall-time limit in
 * seconds (default 600). Exit codes: 0 done, 1 invalid design or a run that could not finish,
 * 2 usage.
 */
import { jointDesignSchema } from "@/features/analysis/schema";
import { fail, readJsonInput } from "./lib/cli-input";
import type { JointDesign } from "@/features/analysis/core/design";
import { FE_DEFAULT_TIME_LIMIT_MS, runFeCheck } from "@/features/fe-check/run-fe-check";
import { formatComparisonTable } from "@/features/fe-check/comparison-text";

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
  const design = readJsonInput(file, jointDesignSchema, "design");
  const abort = new AbortController();
  process.once("SIGINT", () => abort.abort());
  try {
    const result = await runFeCheck(design as JointDesign, {
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
