/**
 * Command line: `npm run suggest -- request.json` runs the pattern search ("Suggest pattern") on a
 * request (the same body as POST /api/v1/suggestions: `design` and the allowed sizes, materials,
 * offsets and constraints) and prints the ranked candidates, or the sentence naming the rule that
 * blocks the request, then the cautions. `--json` prints the whole result as JSON instead.
 * Progress goes to stderr. Exit codes: 0 candidates found, 3 nothing qualifies, 1 invalid request
 * or file, 2 usage.
 */
import { suggestionRequestSchema } from "@/features/analysis/schema";
import { fail, readJsonInput } from "./lib/cli-input";
import { checkSuggestionRequest } from "@/features/analysis/core/suggest/request";
import { suggestPatterns } from "@/features/analysis/core/suggest/search";
import { formatIssue } from "@/features/analysis/core/validate";
import { formatSuggestionText } from "@/features/analysis/suggestion-text";
import { CAUTIONS } from "@/features/ui/cautions";

function main(argv: string[]): void {
  const args = argv.filter((a) => a !== "--");
  const json = args.includes("--json");
  const files = args.filter((a) => a !== "--json");
  if (files.length !== 1 || files[0].startsWith("--"))
    fail(["usage: npm run suggest -- <request.json> [--json]"], 2);
  const file = files[0];
  const request = readJsonInput(file, suggestionRequestSchema, "request");
  const issues = checkSuggestionRequest(request);
  if (issues.length > 0)
    fail([`${file}: the search cannot run on this request`, ...issues.map((i) => `  ${formatIssue(i)}`)]);
  const result = suggestPatterns(request, {
    onProgress: (p) =>
      void process.stderr.write(`searched ${p.done} of ${p.total} combinations (${p.analyses} analyses)\n`),
  });
  if (json) process.stdout.write(`${JSON.stringify(result, null, 2)}\n`);
  else
    process.stdout.write(
      `${formatSuggestionText(result)}\n\n${CAUTIONS.map((c) => `Caution: ${c}`).join("\n")}\n`,
    );
  process.exitCode = result.candidates.length > 0 ? 0 : 3;
}

main(process.argv.slice(2));
