/**
 * Command line: `npm run analyze -- design.json` validates a design document, runs the core and
 * prints the full JointAnalysis as JSON. An invalid design exits with code 1 and one line per
 * issue on stderr, each naming the field. `--schema` prints the JSON Schema of the document.
 */
import { readFileSync } from "node:fs";
import { jointDesignSchema, formatDesignErrors } from "@/features/analysis/schema";
import { getDesignJsonSchema } from "@/features/analysis/json-schema";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";

function fail(lines: string[], code = 1): never {
  for (const l of lines) process.stderr.write(`${l}\n`);
  process.exit(code);
}

function main(argv: string[]): void {
  const args = argv.filter((a) => a !== "--");
  if (args.includes("--schema")) {
    process.stdout.write(`${JSON.stringify(getDesignJsonSchema(), null, 2)}\n`);
    return;
  }
  const file = args[0];
  if (!file) fail(["usage: npm run analyze -- <design.json>   (or --schema)"], 2);
  let text: string;
  try {
    text = readFileSync(file, "utf8");
  } catch (e) {
    fail([`${file}: cannot read file (${(e as NodeJS.ErrnoException).code ?? "error"})`]);
  }
  let raw: unknown;
  try {
    raw = JSON.parse(text);
  } catch (e) {
    fail([`${file}: not valid JSON (${(e as Error).message})`]);
  }
  const parsed = jointDesignSchema.safeParse(raw);
  if (!parsed.success)
    fail([`${file}: invalid design`, ...formatDesignErrors(parsed.error).map((l) => `  ${l}`)]);
  const result = analyzeJoint(parsed.data as JointDesign);
  process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
}

main(process.argv.slice(2));
