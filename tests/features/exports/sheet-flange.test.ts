import { describe, expect, it } from "vitest";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import { renderSpacingSheet } from "@/features/exports/sheet/render-sheet";
import { analyse, loadExample, pdfToText, sheetInputFor } from "./fixtures";

// The bolt-spacing sheet's "Flange" section, read back with poppler (pdftotext).

/** The NPS 6 example with an integral hubbed SA-105 flange: its result and its SI sheet as text. */
async function hubbedSheet(extra: { testPressureMpa?: number }) {
  const design = loadExample("pipe-flange-nps6-spiral-wound");
  design.flangeDesign = {
    kind: "integral-hub",
    hub: { g0Mm: 7.1, g1Mm: 14.2, hMm: 44 },
    flangeMaterialId: "sa-105",
    ...extra,
  };
  const result = analyse(design);
  const pdf = await renderSpacingSheet(sheetInputFor(design, { result, units: "SI" }));
  return { result, text: pdfToText(pdf).replace(/\s+/g, " ") };
}

describe("bolt-spacing sheet: Flange section", () => {
  it("prints the Appendix 2 stresses, rigidity and the test pressure suggestion of the stored result, with the caution", async () => {
    const { result, text } = await hubbedSheet({});
    expect(text).toContain("FLANGE");
    expect(text).toContain("Appendix 2 flange");
    expect(text).toContain("integral, with tapered hub");
    expect(text).toMatch(/Operating: rigidity J \(KI 0.3\) \d+\.\d{3}/);
    expect(text).toContain("Hydrostatic test pressure");
    expect(text).toContain("UG-99");
    expect(text).toContain("code-specific");
    const st = result.flangeDesign.appendix2!.conditions[1].stMpa!;
    expect(text).toContain(`${Number(st.toPrecision(4))} MPa`);
  });
  it("prints the hydrostatic test case at the entered test pressure", async () => {
    const { result, text } = await hubbedSheet({ testPressureMpa: 3 });
    expect(text).toContain("Test case: Wm1 at Pt / bolts at min preload");
    expect(text).toContain("Test case: flange SH, SR, ST");
    const st = result.flangeDesign.hydrotest.testCase!.flange!.stMpa;
    expect(text).toContain(`${Number(st.toPrecision(4))} MPa`);
  });
  it("a result stored by an older core (no flange design) says so instead of inventing numbers", async () => {
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const { flangeDesign: _absent, ...older } = analyse(design);
    const result = older as JointAnalysis; // as stored by a core before 1.2.0
    const text = pdfToText(await renderSpacingSheet(sheetInputFor(design, { result }))).replace(/\s+/g, " ");
    expect(text).toContain("not in this result (computed by core 1.2.0 and later)");
  });
});
