/**
 * `npm run bench [-- section …] [--no-write]`: imports every `bench/*.bench.ts` module (or those
 * whose file name contains one of the given words) and runs its `run()` in file-name order. Each
 * module prints its own lines ("<suite>: <case>  median x ms  (n=…)") and records its figures
 * (bench/report.ts); at the end the figures of the sections that ran are written into README.md's
 * performance table, between its bench markers (bench/readme-table.ts). `--no-write` or
 * BENCH_WRITE=0 leaves README.md alone (the build's route-size listing runs that way). A
 * benchmark, not a test: nothing here fails on a slow machine.
 */
import { readdirSync, readFileSync, writeFileSync } from "node:fs";
import { cpus, loadavg } from "node:os";
import { dirname, join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import { writeBenchTable } from "./readme-table";
import { beginSection, collectedFigures } from "./report";

const here = dirname(fileURLToPath(import.meta.url));
const README = join(here, "..", "README.md");

async function main(): Promise<void> {
  const args = process.argv.slice(2).filter((a) => a !== "--");
  // A script outside the app: it reads its one switch directly (the app's env.ts is server code).
  const write = !args.includes("--no-write") && process.env.BENCH_WRITE !== "0";
  const filter = args.filter((a) => !a.startsWith("--"));
  const started = new Date();
  const load = loadavg();
  const files = readdirSync(here)
    .filter((f) => f.endsWith(".bench.ts"))
    .sort()
    .filter((f) => filter.length === 0 || filter.some((x) => f.includes(x)));
  const sections: string[] = [];
  for (const f of files) {
    const mod = (await import(pathToFileURL(join(here, f)).href)) as { run?: () => Promise<void> };
    if (typeof mod.run !== "function") {
      console.log(`${f}: no exported run() — skipped`);
      continue;
    }
    const section = f.replace(/\.bench\.ts$/, "");
    beginSection(section);
    await mod.run();
    sections.push(section);
  }
  const figures = collectedFigures();
  if (!write || figures.length === 0) {
    if (write && sections.length > 0) console.log("bench: no figures recorded; README.md left alone");
    return;
  }
  const day = started.toISOString().slice(0, 10);
  const cpu = cpus();
  const runLine =
    `${started.toISOString().slice(0, 16).replace("T", " ")} UTC, \`npm run bench${filter.length ? ` -- ${filter.join(" ")}` : ""}\`` +
    ` (${sections.join(", ")}): ${cpu.length} cores (${cpu[0]?.model.trim() ?? "unknown CPU"}), Node ${process.version},` +
    ` load average ${load.map((l) => l.toFixed(1)).join(" / ")} at the start.`;
  const text = readFileSync(README, "utf8");
  const next = writeBenchTable(text, {
    sections,
    figures,
    when: `${day}, load ${load[0].toFixed(1)}`,
    runLine,
  });
  writeFileSync(README, next);
  console.log(
    `bench: README.md performance table: ${figures.length} figures of ${sections.join(", ")} written (\`--no-write\` or BENCH_WRITE=0 to leave it alone)`,
  );
}

// Exits once every section is done: a section's database pool (getDb keeps two idle connections
// open) would otherwise hold the process, and npm run bench with it, open for good.
main().then(
  () => process.exit(process.exitCode ?? 0),
  (e: unknown) => {
    console.error(e instanceof Error ? e.message : e);
    process.exit(1);
  },
);
