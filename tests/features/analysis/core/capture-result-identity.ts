/**
 * Writes tests/features/analysis/fixtures/result-identity.json from the core as it is now. Run it
 * only from a core whose results are the reference (see result-identity-cases.ts).
 */
import { writeFileSync } from "node:fs";
import { IDENTITY_CASES, IDENTITY_FIXTURE, identityOf } from "./result-identity-cases";

const out: Record<string, unknown> = {};
for (const [name, make] of IDENTITY_CASES) out[name] = identityOf(make);
writeFileSync(IDENTITY_FIXTURE, `${JSON.stringify(out, null, 2)}\n`);
console.log(`wrote ${Object.keys(out).length} cases to ${IDENTITY_FIXTURE}`);
