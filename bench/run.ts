/**
 * `npm run bench`: imports every `bench/*.bench.ts` module and runs its `run()` in file-name
 * order. Each module prints its own lines ("<suite>: <case>  median x ms  (n=…)"). A benchmark,
 * not a test: nothing here fails on a slow machine.
 */
import { readdirSync } from "node:fs";
import { dirname, join } from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";

const here = dirname(fileURLToPath(import.meta.url));

async function main(): Promise<void> {
  const filter = process.argv.slice(2).filter((a) => a !== "--");
  const files = readdirSync(here)
    .filter((f) => f.endsWith(".bench.ts"))
    .sort();
  for (const f of files) {
    if (filter.length > 0 && !filter.some((x) => f.includes(x))) continue;
    const mod = (await import(pathToFileURL(join(here, f)).href)) as { run?: () => Promise<void> };
    if (typeof mod.run !== "function") {
      console.log(`${f}: no exported run() — skipped`);
      continue;
    }
    await mod.run();
  }
}

main().catch((e: unknown) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
