import { readdirSync, readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import { percent } from "@/features/analysis/core/units";

// Text the core writes into check notes is read by people: no binary residue such as
// "55.00000000000001 %" (0.55 × 100 in binary floating point).
describe("check notes", () => {
  it("prints percentages without binary residue", () => {
    expect(String(0.55 * 100)).toBe("55.00000000000001"); // the fault this guards against
    expect(percent(0.55)).toBe("55");
    expect(percent(0.075)).toBe("7.5");
  });

  it("hold no number with a run of ten or more decimals in any example's notes and warnings", () => {
    const dir = path.join(process.cwd(), "examples");
    for (const f of readdirSync(dir).filter((x) => x.endsWith(".json"))) {
      const r = analyzeJoint(JSON.parse(readFileSync(path.join(dir, f), "utf8")) as JointDesign);
      const texts = [...r.checks.flatMap((c) => [c.title, c.note, c.source]), ...r.warnings];
      for (const t of texts) expect(t, `${f}: ${t}`).not.toMatch(/\d\.\d{10,}/);
    }
  });
});
