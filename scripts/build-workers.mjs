// Bundles the analysis worker (server/analysis/analysis-worker.ts, with the engineering core it
// imports) into .build/analysis-worker.mjs, the file piscina loads in each worker thread. Next
// bundles the app but not a worker file, so this small step makes one that `next start`,
// `next dev`, vitest and the tsx scripts all load the same way. Run by `npm run build`,
// scripts/start.sh and scripts/test.sh, and by the pool itself outside production.
// Written to a temporary name and renamed, so parallel runs never load a half-written file.
import { randomUUID } from "node:crypto";
import { mkdirSync, renameSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { build } from "esbuild";

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "..");
const outfile = path.join(root, ".build", "analysis-worker.mjs");

const result = await build({
  absWorkingDir: root,
  entryPoints: ["server/analysis/analysis-worker.ts"],
  bundle: true,
  platform: "node",
  format: "esm",
  target: "node20",
  outfile,
  write: false,
  logLevel: "warning",
  legalComments: "none",
});
mkdirSync(path.dirname(outfile), { recursive: true });
const temporary = `${outfile}.${randomUUID()}.tmp`;
writeFileSync(temporary, result.outputFiles[0].contents);
renameSync(temporary, outfile);
