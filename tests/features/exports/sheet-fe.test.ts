import { beforeAll, describe, expect, it } from "vitest";
import { renderSpacingSheet } from "@/features/exports/sheet/render-sheet";
import { runFeCheck } from "@/features/fe-check/run-fe-check";
import { sha256OfJson } from "@/features/analysis/content-hash";
import type { FeCheckResult } from "@/features/fe-check/fe-check-result";
import { analyse, loadExample, pdfToText, sheetInputFor } from "./fixtures";

// The bolt-spacing sheet's "FE cross-check" section, read back with poppler: printed with the
// estimate-against-FE rows and the run's cautions when the revision has a run, left out otherwise.
describe("bolt-spacing sheet: FE cross-check section", () => {
  const design = loadExample("pipe-flange-nps6-spiral-wound");
  let fe: FeCheckResult;
  beforeAll(async () => {
    fe = await runFeCheck(design);
  }, 120_000);

  it("prints the comparison, the cited run's hash and the cautions", async () => {
    const result = analyse(design);
    const input = sheetInputFor(design, { result, units: "SI" });
    const pdf = await renderSpacingSheet({
      ...input,
      feCheck: {
        result: fe,
        resultHash: sha256OfJson(fe),
        finishedAt: "2026-12-03T10:00:00.000Z",
        cited: true,
      },
    });
    const text = pdfToText(pdf).replace(/\s+/g, " ");
    expect(text).toContain("FE CROSS-CHECK");
    expect(text).toContain("cited by the approval");
    expect(text).toContain("Clamped-stack stiffness");
    const k = fe.comparison.find((r) => r.key === "member-stiffness")!;
    expect(text).toContain(`${Number((k.fe! / 1000).toPrecision(4))} kN/mm`);
    expect(text).toContain("not a substitute for an FE analysis qualified under the governing code");
  });

  it("leaves the section out when the revision has no run", async () => {
    const text = pdfToText(await renderSpacingSheet(sheetInputFor(design, { result: analyse(design) })));
    expect(text.replace(/\s+/g, " ")).not.toContain("FE CROSS-CHECK");
  });
});
