import type { PatternCandidate, SuggestionResult } from "./core/suggest/search";

// The pattern search's result as plain text (the `npm run suggest` CLI): one line per candidate
// with its key numbers, or the sentence naming the blocking rule. Lengths in mm, stresses in MPa.

const pct = (m: number | null) => (m === null ? "—" : `${(m * 100).toFixed(1)} %`);
const mm = (v: number) => v.toFixed(1);

/** The governing rule of a candidate as "title (margin)", or "—". */
function governingText(c: PatternCandidate): string {
  return c.governing ? `${c.governing.title} (${pct(c.governing.margin)})` : "—";
}

export function formatSuggestionText(result: SuggestionResult): string {
  const lines: string[] = [];
  const work = `${result.analyses} analyses over ${result.combinations} combinations of size, material and offset`;
  if (result.candidates.length === 0) {
    lines.push(`No pattern qualifies (${work}).`, result.message ?? "");
  } else {
    lines.push(`${result.candidates.length} suggested patterns, best first (${work}):`);
    const rows = result.candidates.map((c) => [
      String(c.rank),
      String(c.boltCount),
      c.designation,
      c.materialName,
      c.offsetMm === null ? "—" : mm(c.offsetMm),
      `${mm(c.pitchMm.min)}–${mm(c.pitchMm.max)}`,
      `${mm(c.seating.minMpa)} / ${mm(c.seating.limitMpa)}`,
      pct(c.seating.margin),
      governingText(c),
    ]);
    const head = [
      "#",
      "bolts",
      "size",
      "material",
      "offset mm",
      "pitch mm",
      "seating min / limit MPa",
      "seating margin",
      "governing rule (margin)",
    ];
    const widths = head.map((h, i) => Math.max(h.length, ...rows.map((r) => r[i].length)));
    for (const r of [head, ...rows])
      lines.push(
        r
          .map((cell, i) => cell.padEnd(widths[i]))
          .join("  ")
          .trimEnd(),
      );
    const carried = [...new Set(result.candidates.flatMap((c) => c.carried))];
    if (carried.length > 0)
      lines.push(`Carried (warn or accepted by rating, no layout changes them): ${carried.join(", ")}`);
  }
  if (result.truncated) lines.push("The work cap ended the search before every combination was settled.");
  lines.push(`Policy: ${result.policy}`);
  return lines.join("\n");
}
