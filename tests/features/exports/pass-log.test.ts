import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import { nmmToFtLb } from "@/features/analysis/core/units";
import { buildBoltRows } from "@/features/exports/model/bolt-rows";
import { buildPassLog, buildPassLogCsv, type PassLog } from "@/features/exports/model/pass-log";
import { renderPassLogSheet, renderSpacingSheet } from "@/features/exports/sheet/render-sheet";
import { passLogFor } from "@/features/exports/shop-files";
import { CAUTIONS } from "@/features/ui/cautions";
import { analyse, loadExample, manyBoltFlange, pdfPageCount, pdfToText, sheetInputFor } from "./fixtures";

// The Pass log, the tightening record: every pass of the stored plan × every bolt, the target of
// what the method measures, and room for the value read, initials and date per pass. The model,
// the CSV, and the sheet's pages read back with pdftotext.
const flat = (s: string) => s.replace(/\s+/g, " ");

function logOf(design: JointDesign) {
  const result = analyse(design);
  const rows = buildBoltRows(design, result.assemblyPlan.sequence);
  return { result, rows, log: buildPassLog(design, result, rows) };
}

describe("Pass log model", () => {
  it("torque wrench: the plan's torque per pass; cross passes in the stored sequence, the circular one by number", () => {
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const { result, log } = logOf(design);
    expect(log.kind).toBe("torque");
    expect(log.passes).toHaveLength(result.assemblyPlan.passes.length);
    log.passes.forEach((p, i) => {
      expect(p.target).toBeCloseTo(result.assemblyPlan.passes[i].torqueNm * 1000, 9);
      expect(p.steps).toHaveLength(8);
      const ids = p.steps.map((s) => s.boltId);
      if (p.pattern === "cross") expect(ids).toEqual(result.assemblyPlan.sequence);
      else expect(p.steps.map((s) => s.boltNumber)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    });
    // PCC-1 legacy passes: 20, 30, 70, 100 % and the circular 100 % pass.
    expect(log.passes.map((p) => p.fraction)).toEqual([0.2, 0.3, 0.7, 1, 1]);
  });

  it("hydraulic tensioner: the residual bolt load, share × the stored target preload", () => {
    const { result, log } = logOf(loadExample("obround-manway"));
    expect(log.kind).toBe("load");
    for (const p of log.passes) expect(p.target).toBeCloseTo(p.fraction * result.preload.targetN, 6);
    expect(log.basis).toContain("load chart");
  });

  it("bolt elongation: stretch = σ·(grip + d)/E, Hooke's law over the grip and half a diameter in each nut", () => {
    // The NPS 6 stud is threaded full length, so kb = As·E/grip and ΔL = F·(1/kb + d/(As·E)) is
    // σ·(grip + d)/E with σ = F/As: grip 54.1 mm (25.4 + 3.3 + 25.4, no washers), d = 19.05 mm,
    // E = 205,000 MPa (the B7 row of the catalogue).
    const base = loadExample("pipe-flange-nps6-spiral-wound");
    const design: JointDesign = { ...base, assembly: { ...base.assembly, method: "bolt-elongation" } };
    const { result, log } = logOf(design);
    expect(log.kind).toBe("elongation");
    expect(result.stiffness.gripMm).toBeCloseTo(54.1, 9);
    const full = (result.preload.targetStressMpa * (54.1 + 19.05)) / 205_000;
    const last = log.passes.at(-1)!;
    expect(last.target).toBeCloseTo(full, 6);
    expect(log.passes[0].target).toBeCloseTo(0.2 * full, 6);
    expect(full).toBeGreaterThan(0.05); // tenths of a millimetre, as a stud stretches
    expect(full).toBeLessThan(0.2);
  });

  it("a stored result without a plan gives no passes (nothing invented)", () => {
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const rows = buildBoltRows(design);
    expect(buildPassLog(design, { preload: { targetN: 1 } }, rows).passes).toEqual([]);
    expect(buildPassLog(design, null, rows).passes).toEqual([]);
  });
});

describe("Pass log CSV", () => {
  it("one row per pass and bolt, the target in the design's unit, empty cells to fill in", () => {
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const result = analyse(design);
    const rows = parse(passLogFor(design, result), { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0])).toEqual([
      "pass",
      "pass_name",
      "pattern",
      "share_of_target_percent",
      "step",
      "bolt_number",
      "bolt_id",
      "target_torque_ft_lb",
      "measured",
      "initials",
      "date",
      "contains_unverified_table_values",
    ]);
    expect(rows).toHaveLength(5 * 8);
    expect(rows.every((r) => r.measured === "" && r.initials === "" && r.date === "")).toBe(true);
    const last = rows.filter((r) => r.pass === "5");
    expect(last.map((r) => r.bolt_number)).toEqual(["1", "2", "3", "4", "5", "6", "7", "8"]);
    expect(Number(last[0].target_torque_ft_lb)).toBe(
      Math.round(nmmToFtLb(result.assemblyPlan.passes[4].torqueNm * 1000)),
    );
  });

  it("neutralises text cells a spreadsheet would run (the shared guard)", () => {
    const log: PassLog = {
      kind: "torque",
      method: "torque-wrench",
      basis: "",
      passes: [
        {
          pass: 1,
          name: '=HYPERLINK("http://evil.example")',
          pattern: "cross",
          fraction: 0.2,
          note: "",
          target: 51_000,
          torqueNmm: 51_000,
          steps: [{ step: 1, boltNumber: 1, boltId: "@b1" }],
        },
      ],
    };
    const [row] = parse(buildPassLogCsv({ units: "SI" }, log), { columns: true }) as Record<string, string>[];
    expect(row.pass_name).toBe('\'=HYPERLINK("http://evil.example")');
    expect(row.bolt_id).toBe("'@b1");
    expect(row.target_torque_N_m).toBe("51");
  });
});

describe("Pass log pages of the bolt-spacing sheet (read back with pdftotext)", () => {
  it("a page of its own: every bolt, every pass with its target, boxes, initials and date, the cautions", async () => {
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const input = sheetInputFor(design, { units: "SI" });
    const pdf = await renderSpacingSheet(input);
    const pages = pdfPageCount(pdf);
    const page = flat(pdfToText(pdf, { first: pages, last: pages, layout: true }));
    expect(page).toContain("PASS LOG");
    const plan = analyse(design).assemblyPlan;
    for (const p of plan.passes) expect(page).toContain(`${p.pass}. ${p.name}`);
    expect(page).toContain(`target ${Math.round(plan.passes[1].torqueNm)} N·m`);
    // One row per bolt in the cross sequence: bolt number, step, then the five targets.
    const t = plan.passes.map((p) => Math.round(p.torqueNm)).join(" ");
    plan.sequence.forEach((id, i) => {
      const n = design.bolts.findIndex((b) => b.id === id) + 1;
      expect(page).toContain(`${n} ${i + 1} ${t}`);
    });
    expect(page).toContain("Initials");
    expect(page).toContain("Date");
    for (const c of CAUTIONS) expect(page).toContain(c.slice(0, 40));
    // The title strip names the revision on the log's page too.
    expect(page).toContain("Sheet".toUpperCase());
    expect(page).toContain(`${pages} of ${pages}`);
  });

  it("a 96-bolt flange flows over pages, each with its initials and date rows and the cautions", async () => {
    const design = manyBoltFlange(96);
    const pdf = await renderSpacingSheet(sheetInputFor(design, { status: "draft" }));
    const pages = pdfPageCount(pdf);
    const texts = Array.from({ length: pages }, (_, i) =>
      flat(pdfToText(pdf, { first: i + 1, last: i + 1, layout: true })),
    );
    const logPages = texts.filter((t) => t.includes("PASS LOG"));
    expect(logPages.length).toBeGreaterThanOrEqual(2);
    expect(logPages[1]).toContain("PASS LOG (CONTINUED)");
    for (const t of logPages) {
      expect(t).toContain("Initials");
      expect(t).toContain("Cautions");
      expect(t).toContain("NOT APPROVED");
    }
    // Every bolt has its row: 96 rows over the log pages, each starting "<bolt> <step>".
    const all = logPages.join(" ");
    for (let step = 1; step <= 96; step++) expect(all).toMatch(new RegExp(`\\b\\d{1,3} ${step} `));
  });
});

describe("Pass log as a PDF of its own (read back with pdftotext)", () => {
  it("holds only the log's pages, with the title strip naming it, the mark of a draft and the cautions", async () => {
    const design = loadExample("obround-manway");
    const pdf = await renderPassLogSheet(sheetInputFor(design, { status: "draft" }));
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    expect(pdfPageCount(pdf)).toBe(1);
    const text = flat(pdfToText(pdf, { layout: true }));
    expect(text).toContain("PASS LOG");
    expect(text).not.toContain("BOLT TABLE");
    expect(text).not.toContain("BOLT-SPACING SHEET");
    expect(text).toContain("DRAFT · NOT APPROVED");
    expect(text).toContain("1 of 1");
    // The tensioner's targets: the residual bolt load per pass, kN.
    expect(text).toContain("Residual bolt load per pass, in kN");
    expect(text).toContain("Initials");
    for (const c of CAUTIONS) expect(text).toContain(c.slice(0, 40));
  });

  it("a stored result without a plan says there is nothing to record, beside the cautions", async () => {
    const design = loadExample("obround-manway");
    const input = sheetInputFor(design);
    // An older stored result without the plan (read as stored, never recomputed).
    const result = { ...input.result!, assemblyPlan: undefined } as unknown as JointAnalysis;
    const text = flat(pdfToText(await renderPassLogSheet({ ...input, result })));
    expect(text).toContain("The stored result has no pass plan: there is nothing to record.");
    expect(text).toContain("Cautions");
  });
});
