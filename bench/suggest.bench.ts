/**
 * Pattern search ("Suggest pattern"): the time to search every metric size (M10…M64) for a
 * 48-bolt rectangular cover and a 96-bolt girth flange (target ≤ 2 s each on the 2-core machine).
 */
import { suggestPatterns } from "@/features/analysis/core/suggest/search";
import { girthFlange96, rectangularCover } from "@/tests/features/analysis/core/fixtures";
import { medianMs, printMedian } from "./measure";
import { figure, formatMs } from "./report";

export async function run(): Promise<void> {
  const cases = [
    ["48-bolt rectangular cover, M10…M64", rectangularCover({ boltCount: 48, widthMm: 1200, heightMm: 800 })],
    ["96-bolt girth flange, M10…M64", girthFlange96()],
  ] as const;
  for (const [label, design] of cases) {
    const once = suggestPatterns({ design });
    const ms = medianMs(() => suggestPatterns({ design }), 5, 1);
    printMedian("suggest", label, ms, 5);
    figure(
      `Pattern search: ${label}`,
      `${formatMs(ms)} (median of 5; ${once.analyses} full analyses over ${once.combinations} combinations)`,
      { goal: "≤ 2 s" },
    );
    const best = once.candidates[0];
    console.log(
      `suggest:   ${once.analyses} full analyses over ${once.combinations} combinations; ${once.candidates.length} candidates${best ? `, first ${best.boltCount} × ${best.designation}` : ""}`,
    );
  }
}
