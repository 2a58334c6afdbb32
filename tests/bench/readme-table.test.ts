import { existsSync, readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import {
  BEGIN_MARKER,
  BenchTableError,
  END_MARKER,
  writeBenchTable,
  type BenchRun,
} from "@/bench/readme-table";

// Internal behaviour (no published source): how `npm run bench` writes README.md's performance
// table between its markers (bench/readme-table.ts).
const HEAD = "# Product\n\nSome text | with a pipe.\n\n## Performance\nIntro.\n\n";
const FOOT = "\n\n## API\nThe rest | untouched.\n";
const TABLE = [
  "| figure | goal | before | measured | ratio | bench | when |",
  "| --- | --- | --- | --- | --- | --- | --- |",
  "| Core: path | ≤ 2 ms | 3.6–7.1 ms | 1.4–2.0 ms | | core | 2026-12-03, load 7–10 |",
  "| Core: grid | ≤ 30 ms | | 5.7 ms | | core | 2026-12-02 |",
  "| Core: against C | ≤ 3× C | 4.8× C | 1.1 ms | 1.6× C | core | 2026-12-03 |",
  "| Sheet: PDF  | < 500 ms |  | 175–220 ms | | sheet | 2026-12-02 |",
  "| CPU per request \\| by hand | | | 4.9 ms | | by hand | 2026-12-03 |",
];
const README = `${HEAD}${BEGIN_MARKER}\n${TABLE.join("\n")}\n\nLast bench run: old line.\n${END_MARKER}${FOOT}`;

const run = (over: Partial<BenchRun> = {}): BenchRun => ({
  sections: ["core"],
  figures: [
    { section: "core", label: "Core: path", measured: "1.31 ms (median of 200)", goal: "≤ 2 ms" },
    { section: "core", label: "Core: against C", measured: "1.20 ms; C 0.71 ms", ratio: "1.69× C" },
  ],
  when: "2026-12-04, load 3.2",
  runLine: "2026-12-04 10:00 UTC, `npm run bench -- core` (core): 2 cores.",
  ...over,
});

const tableOf = (text: string) =>
  text
    .slice(text.indexOf(BEGIN_MARKER), text.indexOf(END_MARKER))
    .split("\n")
    .filter((l) => l.startsWith("|"));

describe("the README's bench table", () => {
  it("replaces the measured, ratio and when cells of the rows that ran and keeps figure and before", () => {
    const rows = tableOf(writeBenchTable(README, run()));
    expect(rows[2]).toBe(
      "| Core: path | ≤ 2 ms | 3.6–7.1 ms | 1.31 ms (median of 200) |  | core | 2026-12-04, load 3.2 |",
    );
    // No goal in the figure: the row's goal stays; a ratio replaces the old one.
    expect(rows[4]).toBe(
      "| Core: against C | ≤ 3× C | 4.8× C | 1.20 ms; C 0.71 ms | 1.69× C | core | 2026-12-04, load 3.2 |",
    );
  });

  it("keeps, byte for byte, the rows the run did not measure, other sections' rows and hand rows", () => {
    const rows = tableOf(writeBenchTable(README, run()));
    expect(rows[3]).toBe(TABLE[3]); // core ran, but this figure was not measured: its old date stays
    expect(rows[5]).toBe(TABLE[5]); // sheet did not run
    expect(rows[6]).toBe(TABLE[6]); // measured by hand
    expect(rows).toHaveLength(TABLE.length);
  });

  it("leaves everything outside the markers untouched and rewrites the run line in place", () => {
    const text = writeBenchTable(README, run());
    expect(text.startsWith(`${HEAD}${BEGIN_MARKER}`)).toBe(true);
    expect(text.endsWith(`${END_MARKER}${FOOT}`)).toBe(true);
    expect(text).not.toContain("old line");
    expect(text).toContain(
      `|\n\nLast bench run: 2026-12-04 10:00 UTC, \`npm run bench -- core\` (core): 2 cores.\n${END_MARKER}`,
    );
    // Writing the same run again changes nothing.
    expect(writeBenchTable(text, run())).toBe(text);
  });

  it("adds a figure without a row after its section's last row, and a new section's at the end, in order", () => {
    const text = writeBenchTable(
      README,
      run({
        sections: ["core", "suggest"],
        figures: [
          { section: "core", label: "Core: new figure", measured: "2.00 ms" },
          { section: "suggest", label: "Search: one", measured: "320 ms", goal: "≤ 2 s" },
          { section: "suggest", label: "Search: two | pipe", measured: "650 ms" },
        ],
      }),
    );
    const rows = tableOf(text);
    expect(rows[5]).toBe("| Core: new figure |  |  | 2.00 ms |  | core | 2026-12-04, load 3.2 |");
    expect(rows[6]).toBe(TABLE[5]);
    expect(rows[8]).toBe("| Search: one | ≤ 2 s |  | 320 ms |  | suggest | 2026-12-04, load 3.2 |");
    expect(rows[9]).toBe("| Search: two \\| pipe |  |  | 650 ms |  | suggest | 2026-12-04, load 3.2 |");
    // The escaped pipe is read back as one cell: a second run updates the same row.
    const again = tableOf(
      writeBenchTable(
        text,
        run({
          sections: ["suggest"],
          figures: [{ section: "suggest", label: "Search: two | pipe", measured: "600 ms" }],
        }),
      ),
    );
    expect(again).toHaveLength(rows.length);
    expect(again[9]).toContain("| 600 ms |");
  });

  it("refuses, with a clear message, a README without its markers or its columns", () => {
    expect(() => writeBenchTable(README.replace(BEGIN_MARKER, ""), run())).toThrow(BenchTableError);
    expect(() => writeBenchTable(README.replace(BEGIN_MARKER, ""), run())).toThrow(
      /README.md has no <!-- bench:begin --> marker.*Nothing was written/,
    );
    expect(() => writeBenchTable(README.replace(END_MARKER, ""), run())).toThrow(
      /no <!-- bench:end --> marker/,
    );
    const swapped = `${HEAD}${END_MARKER}\n${TABLE.join("\n")}\n${BEGIN_MARKER}${FOOT}`;
    expect(() => writeBenchTable(swapped, run())).toThrow(/before <!-- bench:begin -->/);
    expect(() => writeBenchTable(README + README, run())).toThrow(/more than one pair/);
    expect(() => writeBenchTable(README.replace("| ratio ", "| share "), run())).toThrow(/no "ratio" column/);
    expect(() => writeBenchTable(`${BEGIN_MARKER}\nno table\n${END_MARKER}`, run())).toThrow(/no table/);
    expect(() =>
      writeBenchTable(
        README,
        run({ figures: [{ section: "sheet", label: "Sheet: PDF", measured: "1 ms" }] }),
      ),
    ).toThrow(/did not list it/);
  });

  it("the real README has the table, and every row names a bench section, a test or 'by hand'", () => {
    const readme = readFileSync("README.md", "utf8");
    const rows = tableOf(readme).slice(2);
    expect(rows.length).toBeGreaterThan(20);
    for (const row of rows) {
      const bench = row.split(/(?<!\\)\|/)[6].trim();
      const known = bench === "by hand" || existsSync(`bench/${bench}.bench.ts`) || existsSync(bench);
      expect(known, row).toBe(true);
    }
    // The writer accepts it, and a run of no figures changes only the run line.
    const written = writeBenchTable(readme, run({ sections: ["core"], figures: [] }));
    expect(tableOf(written)).toEqual(tableOf(readme));
  });
});
