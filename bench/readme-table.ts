/**
 * The README's performance table, written by `npm run bench` between two markers:
 *
 *   <!-- bench:begin -->
 *   | figure | goal | before | measured | ratio | bench | when |
 *   | --- | --- | --- | --- | --- | --- | --- |
 *   | Core: … | ≤ 2 ms | 3.6–7.1 ms | 1.42 ms | | core | 2026-12-03, load 8.1 |
 *   Last bench run: …
 *   <!-- bench:end -->
 *
 * A row belongs to the bench section named in its `bench` cell (the file name in bench/ without
 * `.bench.ts`). A run replaces, in the rows of the sections that ran, the cells it measured
 * (measured, ratio, when, and goal when the bench states one) and keeps `figure` and the
 * hand-written `before`. Rows of sections that did not run, rows the run did not measure, and
 * rows whose `bench` cell names no section (figures measured by hand or by a test) stay as they
 * are, byte for byte, with their own date. A figure without a row is added after its section's
 * last row. The text outside the markers is never touched. Pure: text in, text out.
 */

export const BEGIN_MARKER = "<!-- bench:begin -->";
export const END_MARKER = "<!-- bench:end -->";
const COLUMNS = ["figure", "goal", "before", "measured", "ratio", "bench", "when"] as const;
type Column = (typeof COLUMNS)[number];
const RUN_LINE = "Last bench run: ";

/** One figure a bench section measured: the row it goes to is (section, label). */
export interface BenchFigure {
  section: string;
  label: string;
  measured: string;
  /** The goal as the bench states it; absent: the row's goal cell is kept. */
  goal?: string;
  /** Against a reference run in the same invocation (C, pgbench, in-thread); absent: empty. */
  ratio?: string;
}

export interface BenchRun {
  /** The sections that ran (bench file names without `.bench.ts`). */
  sections: string[];
  figures: BenchFigure[];
  /** The `when` cell of every row this run writes, e.g. "2026-12-03, load 8.1". */
  when: string;
  /** The line under the table: date, the command, the machine. */
  runLine: string;
}

export class BenchTableError extends Error {
  override name = "BenchTableError";
}

/** Splits a Markdown table row on its unescaped pipes; the cells come back trimmed and unescaped. */
function cells(line: string): string[] {
  const inner = line.trim().replace(/^\|/, "").replace(/\|$/, "");
  return inner.split(/(?<!\\)\|/).map((c) => c.trim().replace(/\\\|/g, "|"));
}

const escape = (value: string) => value.replace(/\r?\n/g, " ").replace(/\|/g, "\\|");

/** The README text with the performance table between the markers brought up to date. */
export function writeBenchTable(readme: string, run: BenchRun): string {
  const begin = readme.indexOf(BEGIN_MARKER);
  const end = readme.indexOf(END_MARKER);
  if (begin < 0 || end < 0)
    throw new BenchTableError(
      `README.md has no ${begin < 0 ? BEGIN_MARKER : END_MARKER} marker: the bench writes its table between ${BEGIN_MARKER} and ${END_MARKER} (DEVELOPERS.md, "Benchmarks"). Nothing was written.`,
    );
  if (readme.indexOf(BEGIN_MARKER, begin + 1) >= 0 || readme.indexOf(END_MARKER, end + 1) >= 0)
    throw new BenchTableError("README.md has more than one pair of bench markers. Nothing was written.");
  if (end < begin)
    throw new BenchTableError(`README.md has ${END_MARKER} before ${BEGIN_MARKER}. Nothing was written.`);

  const before = readme.slice(0, begin + BEGIN_MARKER.length);
  const after = readme.slice(end);
  const lines = readme.slice(begin + BEGIN_MARKER.length, end).split("\n");

  const headerAt = lines.findIndex((l) => l.trim().startsWith("|"));
  if (headerAt < 0) throw new BenchTableError("README.md has no table between the bench markers.");
  const header = cells(lines[headerAt]);
  const index = {} as Record<Column, number>;
  for (const name of COLUMNS) {
    index[name] = header.indexOf(name);
    if (index[name] < 0)
      throw new BenchTableError(
        `The bench table has no "${name}" column (it needs ${COLUMNS.join(", ")}). Nothing was written.`,
      );
  }
  if (!/^\s*\|(\s*:?-+:?\s*\|)+\s*$/.test(lines[headerAt + 1] ?? ""))
    throw new BenchTableError("The bench table's header is not followed by its |---| line.");
  let tableEnd = headerAt + 2;
  while (tableEnd < lines.length && lines[tableEnd].trim().startsWith("|")) tableEnd++;

  const ran = new Set(run.sections);
  const pending = new Map<string, BenchFigure>();
  for (const f of run.figures) {
    if (!ran.has(f.section))
      throw new BenchTableError(`A figure of section "${f.section}" came from a run that did not list it.`);
    const key = `${f.section}\n${f.label}`;
    if (pending.has(key)) throw new BenchTableError(`Two figures are labelled "${f.label}" (${f.section}).`);
    pending.set(key, f);
  }

  const row = (values: Record<Column, string>) =>
    `| ${header.map((name) => escape(values[name as Column] ?? "")).join(" | ")} |`;
  const rows: string[] = [];
  const lastOfSection = new Map<string, number>();
  for (const line of lines.slice(headerAt + 2, tableEnd)) {
    const c = cells(line);
    const section = c[index.bench] ?? "";
    const key = `${section}\n${c[index.figure] ?? ""}`;
    const figure = pending.get(key);
    if (figure) {
      pending.delete(key);
      const values = Object.fromEntries(header.map((name, i) => [name, c[i] ?? ""])) as Record<
        Column,
        string
      >;
      values.measured = figure.measured;
      values.ratio = figure.ratio ?? "";
      values.when = run.when;
      if (figure.goal !== undefined) values.goal = figure.goal;
      rows.push(row(values));
    } else rows.push(line);
    if (ran.has(section)) lastOfSection.set(section, rows.length - 1);
  }
  // Figures without a row yet: after their section's last row (the end of the table for a new section).
  for (const f of pending.values()) {
    const at = (lastOfSection.get(f.section) ?? rows.length - 1) + 1;
    rows.splice(
      at,
      0,
      row({
        figure: f.label,
        goal: f.goal ?? "",
        before: "",
        measured: f.measured,
        ratio: f.ratio ?? "",
        bench: f.section,
        when: run.when,
      }),
    );
    for (const [s, i] of lastOfSection) if (i >= at) lastOfSection.set(s, i + 1);
    lastOfSection.set(f.section, at);
  }

  // Under the table: a blank line (else Markdown reads the next line as a row), the run line, and
  // whatever else was written there by hand; the end marker starts a line of its own.
  const rest = lines.slice(tableEnd).filter((l) => !l.startsWith(RUN_LINE));
  while (rest.length > 0 && rest[0].trim() === "") rest.shift();
  if (rest.at(-1) !== "") rest.push("");
  const middle = [...lines.slice(0, headerAt + 2), ...rows, "", `${RUN_LINE}${run.runLine}`];
  if (rest.length > 1) middle.push("");
  return before + [...middle, ...rest].join("\n") + after;
}
