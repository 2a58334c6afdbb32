import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import type { JointAnalysis } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import { isTaggedFromMemory, listUnverifiedValues } from "@/features/analysis/unverified-values";
import { UNVERIFIED_COLUMN } from "@/features/exports/model/hole-list";
import { renderSpacingSheet } from "@/features/exports/sheet/render-sheet";
import { drillingTemplateFor, holeListFor } from "@/features/exports/shop-files";
import { parseDxfText } from "@/features/imports/model/dxf-entities";
import { parseBoltCsv } from "@/features/imports/model/parse-bolt-csv";
import {
  analyse,
  EXPORTED_AT,
  loadExample,
  pdfPageCount,
  pdfToText,
  revisionFactsFor,
  sheetInputFor,
} from "./fixtures";

// "contains unverified table values" on the shop files while the stored result holds table values
// taken from memory: the sheet's title strip on every page (read back with pdftotext), the hole
// list's header, the drilling template's title; and nowhere once none remain.
const MARK = "contains unverified table values";
const flat = (s: string) => s.replace(/\s+/g, " ");

/** The NPS 6 example with every remembered value taken out: its own gasket data and a result without tags. */
function verifiedCase(): { design: JointDesign; result: JointAnalysis } {
  const base = loadExample("pipe-flange-nps6-spiral-wound");
  const design: JointDesign = {
    ...base,
    gasket: {
      ...base.gasket,
      material: {
        ...base.gasket.material,
        modulusMpa: 1234,
        thicknessMm: 3.05,
        source: "maker's test report 2026-114",
      },
    },
  };
  const r = analyse(design);
  const result: JointAnalysis = {
    ...r,
    catalogueEditions: r.catalogueEditions.filter((e) => e.confidence !== "mem"),
    checks: r.checks.filter((c) => !isTaggedFromMemory(c.source) && !isTaggedFromMemory(c.note)),
    assumptions: r.assumptions.filter((a) => !isTaggedFromMemory(a)),
  };
  return { design, result };
}

describe("the unverified-values mark on the shop files", () => {
  it("bolt-spacing sheet: the title strip of every page says so, and the list is printed", async () => {
    const design = loadExample("obround-manway");
    const input = sheetInputFor(design);
    const unverified = listUnverifiedValues(design, JSON.parse(JSON.stringify(input.result)));
    expect(unverified.length).toBeGreaterThan(0);
    const pdf = await renderSpacingSheet(input);
    const pages = pdfPageCount(pdf);
    expect(pages).toBeGreaterThan(1);
    for (let p = 1; p <= pages; p++)
      expect(flat(pdfToText(pdf, { first: p, last: p }))).toContain(`APPROVED · ${MARK}`);
    const text = flat(pdfToText(pdf));
    expect(text).toContain("UNVERIFIED TABLE VALUES");
    expect(text).toContain("Nut across flats (M24)");
    expect(text).toContain("Gasket factor m");
  });

  it("a draft keeps its NOT APPROVED words beside the mark", async () => {
    const pdf = await renderSpacingSheet(sheetInputFor(loadExample("obround-manway"), { status: "draft" }));
    expect(flat(pdfToText(pdf, { first: 1, last: 1 }))).toContain(`DRAFT · NOT APPROVED · ${MARK}`);
  });

  it("no mark and no list when no unverified value remains", async () => {
    const { design, result } = verifiedCase();
    expect(listUnverifiedValues(design, result)).toEqual([]);
    const pdf = await renderSpacingSheet(sheetInputFor(design, { result }));
    const text = flat(pdfToText(pdf));
    expect(text).not.toContain(MARK);
    expect(text).not.toContain("UNVERIFIED TABLE VALUES");
    expect(text).toContain("APPROVED");
    expect(holeListFor(design, result).split("\r\n")[0]).not.toContain(UNVERIFIED_COLUMN);
    const dxf = parseDxfText(drillingTemplateFor(design, result, revisionFactsFor(design), EXPORTED_AT))!;
    expect(
      dxf.entities.some(
        (e) => e.layer === "TITLE" && /UNVERIFIED/.test(String((e as { text?: string }).text)),
      ),
    ).toBe(false);
  });

  it("hole list: a header column of its own, and the bolt CSV intake still reads the file", () => {
    const design = loadExample("obround-manway");
    const result = analyse(design);
    const csv = holeListFor(design, result);
    const rows = parse(csv, { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0]!)).toContain("contains_unverified_table_values");
    expect(rows.every((r) => r.contains_unverified_table_values === "yes")).toBe(true);
    const read = parseBoltCsv(csv);
    expect(read.ok && read.holes.length).toBe(design.bolts.length);
  });

  it("drilling template: the TITLE layer says so (read with the project's DXF reader)", () => {
    const design = loadExample("obround-manway");
    const dxf = parseDxfText(
      drillingTemplateFor(design, analyse(design), revisionFactsFor(design), EXPORTED_AT),
    )!;
    const titles = dxf.entities.filter((e) => e.layer === "TITLE").map((e) => (e as { text?: string }).text);
    expect(titles).toContain(MARK.toUpperCase());
  });
});
