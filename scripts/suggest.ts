/**
 * Command line: `npm run suggest -- request.json` runs the pattern search ("Suggest pattern") on a
 * request (the same body as POST /api/v1/suggestions: `design` and the allowed sizes, materials,
 * offsets and constraints) and prints the ranked candidates, or the sentence naming the rule that
 * blocks the request, then the cautions. `--json` prints the whole result as JSON instead.
 * `--bolting FILE` offers stocked bolting: the Stockroom's bolting export, `stockroom-bolting.csv`
 * (one line per size range, lines of one name one material, ids "csv:<first line>") or the JSON of
 * GET /api/v1/library/bolting (`{ rows }`, or the rows alone; built-in rows as their catalogue id).
 * Without `materialIds` in the request every row of the file is tried. Progress goes to stderr.
 * Exit codes: 0 candidates found, 3 nothing qualifies, 1 invalid request or file, 2 usage.
 */
import { readFileSync } from "node:fs";
import { z } from "zod";
import {
  formatDesignErrors,
  stockedBoltMaterialSchema,
  suggestionRequestSchema,
} from "@/features/analysis/schema";
import { fail, readJsonInput } from "./lib/cli-input";
import { checkSuggestionRequest, type SuggestionRequest } from "@/features/analysis/core/suggest/request";
import { suggestPatterns } from "@/features/analysis/core/suggest/search";
import { formatIssue } from "@/features/analysis/core/validate";
import { formatSuggestionText } from "@/features/analysis/suggestion-text";
import { CAUTIONS } from "@/features/ui/cautions";
import { describeCsvError, parseLibraryCsv } from "@/features/library/model/library-csv";
import { searchMaterialsOf, stockedRowsFromCsv } from "@/features/library/model/stocked-bolting";

const USAGE =
  "usage: npm run suggest -- <request.json> [--bolting stockroom-bolting.csv|bolting.json] [--json]";

/** The Stockroom listing's bolting rows as JSON: what GET /api/v1/library/bolting answers. */
const listedRowSchema = stockedBoltMaterialSchema
  .omit({ edition: true })
  .extend({
    id: z.string().min(1).max(60),
    origin: z.enum(["builtin", "organization"]),
    rowId: z.string().min(1).max(60),
    edition: z.string().max(200).default(""),
  })
  .loose();
const listingSchema = z.union([
  z.array(listedRowSchema),
  z.object({ rows: z.array(listedRowSchema) }).loose(),
]);

/** The materials a bolting file offers: materialIds and the stocked rows behind them. */
function readBolting(file: string): Pick<SuggestionRequest, "materialIds" | "stockedBolting"> {
  let bytes: Buffer;
  try {
    bytes = readFileSync(file);
  } catch {
    fail([`${file}: cannot read file`]);
  }
  if (file.toLowerCase().endsWith(".csv")) {
    const parsed = parseLibraryCsv("bolting", new Uint8Array(bytes));
    if (!parsed.ok)
      fail([
        `${file}: not a Stockroom bolting file`,
        `  ${parsed.message}`,
        ...parsed.errors.slice(1).map((e) => `  ${describeCsvError(e)}`),
      ]);
    const stockedBolting = stockedRowsFromCsv(parsed.inputs);
    return { materialIds: stockedBolting.map((r) => r.id), stockedBolting };
  }
  let raw: unknown;
  try {
    raw = JSON.parse(bytes.toString("utf8"));
  } catch (e) {
    fail([`${file}: not valid JSON (${(e as Error).message})`]);
  }
  const listed = listingSchema.safeParse(raw);
  if (!listed.success)
    fail([
      `${file}: not a Stockroom bolting listing`,
      ...formatDesignErrors(listed.error).map((l) => `  ${l}`),
    ]);
  return searchMaterialsOf(Array.isArray(listed.data) ? listed.data : listed.data.rows);
}

function main(argv: string[]): void {
  const args = argv.filter((a) => a !== "--");
  const json = args.includes("--json");
  const at = args.indexOf("--bolting");
  const boltingFile = at >= 0 ? args[at + 1] : undefined;
  if (at >= 0 && (!boltingFile || boltingFile.startsWith("--"))) fail([USAGE], 2);
  const files = args.filter((a, i) => a !== "--json" && (at < 0 || (i !== at && i !== at + 1)));
  if (files.length !== 1 || files[0].startsWith("--")) fail([USAGE], 2);
  const file = files[0];
  let request = readJsonInput(file, suggestionRequestSchema, "request");
  if (boltingFile) {
    const offered = readBolting(boltingFile);
    request = {
      ...request,
      materialIds: request.materialIds ?? offered.materialIds,
      stockedBolting: [...(request.stockedBolting ?? []), ...(offered.stockedBolting ?? [])],
    };
  }
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
