// Reads vitest's and Playwright's JSON reports and prints one closing line "N passed, N failed"
// (plus skipped), the line CI reads. Exits 1 when anything failed or a report is missing.
import { existsSync, readFileSync } from "node:fs";

const [vitestPath, playwrightPath] = process.argv.slice(2);
let passed = 0;
let failed = 0;
let skipped = 0;
let missing = [];

if (existsSync(vitestPath)) {
  const report = JSON.parse(readFileSync(vitestPath, "utf8"));
  passed += report.numPassedTests ?? 0;
  failed += (report.numFailedTests ?? 0) + (report.numRuntimeErrorTestSuites ?? 0);
  skipped += (report.numPendingTests ?? 0) + (report.numTodoTests ?? 0);
  console.log(
    `vitest: ${report.numPassedTests} passed, ${report.numFailedTests} failed in ${report.numTotalTestSuites} suites`,
  );
} else missing.push("vitest");

if (playwrightPath === "--vitest-only") {
  // a narrowed developer run without the browser tests
} else if (existsSync(playwrightPath)) {
  const stats = JSON.parse(readFileSync(playwrightPath, "utf8")).stats ?? {};
  passed += stats.expected ?? 0;
  failed += stats.unexpected ?? 0;
  passed += stats.flaky ?? 0; // passed on its retry; listed above by the list reporter
  skipped += stats.skipped ?? 0;
  console.log(
    `playwright: ${stats.expected ?? 0} passed, ${stats.unexpected ?? 0} failed, ${stats.flaky ?? 0} flaky`,
  );
} else missing.push("playwright");

if (missing.length) {
  console.log(`missing test reports: ${missing.join(", ")}`);
  failed += missing.length;
}
console.log(`${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(failed === 0 && passed > 0 ? 0 : 1);
