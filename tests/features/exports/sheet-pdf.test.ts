import { getBoltMaterialById } from "@/features/analysis/core/catalogue/bolt-materials";
import { describe, expect, it } from "vitest";
import type { JointDesign } from "@/features/analysis/core/design";
import {
  getBoltPath,
  getBoltPoints,
  getNeighbourSpacings,
  pointAtArcLength,
} from "@/features/analysis/core/geometry";
import { flangeTransform } from "@/features/exports/sheet/draw-flange";
import { fontFor, printable } from "@/features/exports/sheet/fonts";
import { drawingBox, renderSpacingSheet } from "@/features/exports/sheet/render-sheet";
import type { SheetInput } from "@/features/exports/sheet/sheet-input";
import {
  analyse,
  loadExample,
  manyBoltFlange,
  pdfPageCount,
  pdfToText,
  pdfWords,
  renderFirstPagePng,
  sheetInputFor,
  type Raster,
} from "./fixtures";

// The bolt-spacing sheet read back the way a person or a script would: text extraction
// (pdftotext), the first page as a 50 dpi PNG (pdftoppm), and the raw bytes.

/** Share of 48 samples on the hole's rim (at the scale of page 1) that carry ink. */
function rimInk(raster: Raster, input: SheetInput, xMm: number, yMm: number, dpi: number): number {
  const t = flangeTransform(drawingBox(input.paper), input.document.outline);
  const k = dpi / 72;
  const r = (input.document.fastener.holeDiameterMm / 2) * t.ptPerMm * k;
  const cx = (t.cx + xMm * t.ptPerMm) * k;
  const cy = (t.cy - yMm * t.ptPerMm) * k;
  let ink = 0;
  for (let i = 0; i < 48; i++) {
    const a = (i / 48) * 2 * Math.PI;
    const x = Math.round(cx + r * Math.cos(a));
    const y = Math.round(cy + r * Math.sin(a));
    if (raster.gray[y * raster.width + x] < 215) ink++;
  }
  return ink / 48;
}

/** How many of the design's bolt positions show a drawn hole on page 1 (and how many gaps do). */
function countDrawnHoles(
  pdf: Buffer,
  input: SheetInput,
  expected: JointDesign,
): { holes: number; gaps: number; blank: boolean } {
  const { raster } = renderFirstPagePng(pdf, 50);
  const blank = raster.gray.every((v) => v > 250);
  const holes = getBoltPoints(expected).filter((p) => rimInk(raster, input, p.x, p.y, 50) >= 0.5).length;
  // Midway between neighbours along the path (skipping the first pair, which carries the pitch callout).
  const path = getBoltPath(expected.outline, expected.boltPath);
  const spacing = getNeighbourSpacings(expected);
  const gaps = expected.bolts.slice(1).filter((b) => {
    const s = spacing.find((x) => x.fromId === b.id);
    if (!s) return false;
    const q = pointAtArcLength(path, b.sMm + s.pitchMm / 2);
    return rimInk(raster, input, q.x, q.y, 50) >= 0.5;
  }).length;
  return { holes, gaps, blank };
}

describe("bolt-spacing sheet (pdfkit, read back with poppler)", () => {
  it("names the revision, shows every bolt number and the stored check statuses", async () => {
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const input = sheetInputFor(design);
    const pdf = await renderSpacingSheet(input);
    expect(pdf.subarray(0, 5).toString()).toBe("%PDF-");
    const text = pdfToText(pdf);
    expect(text).toContain("Bolt-spacing sheet");
    expect(text).toMatch(/revision 7/);
    expect(text).toContain(input.revision.contentHash!.slice(0, 40));
    expect(text).toContain("Dana Designer");
    // The bolt material by its name, never its catalogue id.
    // (pdftotext joins a word hyphenated at a cell's line break, so hyphens are left out of the match)
    expect(text.replace(/\s+/g, " ").replace(/-/g, "")).toContain(
      getBoltMaterialById(design.fastener.materialId)!.name.replace(/-/g, ""),
    );
    // (the catalogue id stays only in "Tables and editions used", as the row's reference)
    expect(text).not.toMatch(new RegExp(`Bolt material\\s+${design.fastener.materialId}`));
    expect(text).toContain("Arlo Approver");
    expect(text).toContain("2026-11-30");
    expect(text).not.toContain("NOT APPROVED");
    // Every bolt is a row of the bolt table: "<number> b<number>" at the start of a line.
    for (let i = 1; i <= design.bolts.length; i++)
      expect(text).toMatch(new RegExp(`^${i}\\s+${design.bolts[i - 1].id}\\b`, "m"));
    const result = input.result as ReturnType<typeof analyse>;
    // One row per rule (pair and per-bolt checks grouped): each row shows the worst stored
    // status of its rule and how many pairs or bolts it holds; internal ids never print.
    const flat = text.replace(/\s+/g, " ");
    const word = {
      pass: "PASS",
      warn: "WARN",
      fail: "FAIL",
      "not-applicable": "N/A",
      "accepted-by-rating": "RATED",
    } as const;
    const kinds = new Map<string, typeof result.checks>();
    for (const c of result.checks) {
      const kind = c.id.split(":")[0];
      kinds.set(kind, [...(kinds.get(kind) ?? []), c]);
    }
    const rank = { fail: 4, warn: 3, "accepted-by-rating": 2, pass: 1, "not-applicable": 0 } as const;
    for (const list of kinds.values()) {
      const worst = list.reduce((w, c) => (rank[c.status] > rank[w.status] ? c : w));
      expect(flat).toContain(word[worst.status]);
      if (list.length > 1) expect(flat).toMatch(new RegExp(`${list.length} (pairs|bolts):`));
    }
    expect(flat).not.toMatch(/spacing\.[a-z-]+:b\d/);
    // Stored counts appear as stored (no recomputation): "<p> pass · <w> warn · <f> fail".
    expect(text.replace(/\s+/g, " ")).toContain(
      `${result.summary.passCount} pass · ${result.summary.warnCount} warn · ${result.summary.failCount} fail`,
    );
    for (const caution of ["engineering estimates", "governing code", "gasket manufacturer", "licensed"])
      expect(text).toContain(caution);
    expect(text).toContain("TABLES AND EDITIONS USED");
    expect(text).toContain("ASSEMBLY PLAN");
    expect(text).toContain("GASKET STRESS ALONG THE PATH");
  });

  it("marks a sheet that is not approved, on every page", async () => {
    for (const status of ["draft", "in_review", "returned"] as const) {
      const pdf = await renderSpacingSheet(sheetInputFor(loadExample("obround-manway"), { status }));
      const pages = pdfPageCount(pdf);
      expect(pages).toBeGreaterThan(1);
      for (let p = 1; p <= pages; p++)
        expect(pdfToText(pdf, { first: p, last: p })).toContain("NOT APPROVED");
    }
  });

  it("draws a hole at every bolt position of page 1 (50 dpi PNG), and the measure misses a removed bolt", async () => {
    for (const design of [
      loadExample("pipe-flange-nps6-spiral-wound"),
      loadExample("obround-manway"),
      loadExample("rectangular-cover-full-face"),
    ]) {
      const input = sheetInputFor(design);
      const full = countDrawnHoles(await renderSpacingSheet(input), input, design);
      expect(full.blank).toBe(false);
      expect(full.holes).toBe(design.bolts.length);
      expect(full.gaps).toBe(0);
      // The same sheet with the third bolt taken out of the document: one hole fewer is found.
      const fewer = { ...design, bolts: design.bolts.filter((_, i) => i !== 2) };
      const inputFewer = sheetInputFor(fewer);
      expect(countDrawnHoles(await renderSpacingSheet(inputFewer), inputFewer, design).holes).toBe(
        design.bolts.length - 1,
      );
    }
  });

  it("lays a 96-bolt flange over several pages: every bolt labelled in the drawing and listed, title strip on each page", async () => {
    const design = manyBoltFlange(96);
    const input = sheetInputFor(design, { status: "in_review" });
    const pdf = await renderSpacingSheet(input);
    const pages = pdfPageCount(pdf);
    expect(pages).toBeGreaterThanOrEqual(3);
    for (let p = 1; p <= pages; p++) {
      const pageText = pdfToText(pdf, { first: p, last: p });
      expect(pageText).toContain(`${p} of ${pages}`);
      expect(pageText).toContain("Girth flange, 96 bolts");
    }
    // Page 1: the numbers 1…96 inside the drawing frame (the hole labels), each exactly once
    // (the scale note along the frame's foot is left out).
    const box = drawingBox("a4");
    const { words } = pdfWords(pdf, 1);
    const labels = words
      .filter(
        (w) =>
          /^\d+$/.test(w.text) &&
          w.xMin >= box.x &&
          w.xMax <= box.x + box.w &&
          w.yMin >= box.y &&
          w.yMax <= box.y + box.h - 12,
      )
      .map((w) => Number(w.text))
      .sort((a, b) => a - b);
    expect(labels).toEqual(Array.from({ length: 96 }, (_, i) => i + 1));
    const text = pdfToText(pdf);
    for (let i = 1; i <= 96; i++) expect(text).toMatch(new RegExp(`^${i}\\s+b${i}\\b`, "m"));
  });

  it("prints Greek letters and maths signs as themselves (complete fonts, no ASCII stand-ins)", async () => {
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const base = sheetInputFor(design);
    // Check titles as the core writes them (features/analysis/core), plus a design name of our own.
    const input = { ...base, design: { ...base.design, name: "Σ F test π·d² ± 5 µm Ø10 漢" } };
    const text = pdfToText(await renderSpacingSheet(input));
    expect(text).toContain("Ab ≥ required Am");
    expect(text).toContain("2b·π·G·m·P");
    expect(text).toMatch(/tanφ = 0\.362/);
    expect(text).toContain("≤");
    expect(text).toContain("mm²");
    // The design name in the title strip: every sign kept; the one character no face has is "?".
    expect(text).toContain("Σ F test π·d² ± 5 µm Ø10 ?");
    expect(text).not.toMatch(/>=|<=|\bpi\b|\bsum\b|\bsqrt\b/);
    // A sign the text face lacks (≲, U+2272) sets that string in the figures face, which has it.
    expect(fontFor("sans", "|r| ≲ π/4")).toBe("mono");
    expect(fontFor("sans", "|r| ≤ π/4")).toBe("sans");
    expect(fontFor("mono", "λ = 0.012 1/mm")).toBe("mono");
    expect(printable("a漢b")).toBe("a?b");
  });

  it("is byte-stable for an approved revision apart from the two date strings", async () => {
    const input = sheetInputFor(loadExample("pipe-flange-nps6-spiral-wound"));
    const a = await renderSpacingSheet(input);
    const b = await renderSpacingSheet({ ...input });
    expect(Buffer.compare(a, b)).toBe(0);
    const c = await renderSpacingSheet({ ...input, createdAt: new Date("2027-03-04T05:06:07.000Z") });
    expect(c.length).toBe(a.length);
    const dateA = "D:20261201080000Z";
    const dateC = "D:20270304050607Z";
    expect(a.toString("latin1").split(dateA).length - 1).toBe(2); // CreationDate and ModDate
    expect(Buffer.compare(Buffer.from(c.toString("latin1").replaceAll(dateC, dateA), "latin1"), a)).toBe(0);
  });

  it("follows the paper and unit choice", async () => {
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const letter = await renderSpacingSheet(sheetInputFor(design, { paper: "letter", units: "US" }));
    expect(pdfWords(letter, 1).width).toBeCloseTo(612, 0);
    expect(pdfWords(letter, 1).height).toBeCloseTo(792, 0);
    const us = pdfToText(letter);
    expect(us).toContain("x in");
    expect(us).toContain("ft·lb");
    const a4 = await renderSpacingSheet(sheetInputFor(design, { paper: "a4", units: "SI" }));
    expect(pdfWords(a4, 1).width).toBeCloseTo(595.28, 0);
    const si = pdfToText(a4);
    expect(si).toContain("x mm");
    expect(si).toContain("N·m");
  });

  it("prints approved justifications beside their check", async () => {
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const result = analyse(design);
    const open = result.checks.find((c) => c.status === "warn" || c.status === "fail");
    if (!open) return; // the example passes everything: nothing to justify
    const input = sheetInputFor(design, {
      result,
      justifications: [
        {
          checkId: open.id,
          status: open.status as "warn" | "fail",
          text: "Accepted by the shop: studs replaced by B16 stock.",
          by: "Arlo Approver",
          at: "2026-11-30T09:00:00.000Z",
        },
      ],
    });
    const text = pdfToText(await renderSpacingSheet(input)).replace(/\s+/g, " ");
    expect(text).toContain("Accepted by the shop: studs replaced by B16 stock.");
  });
});
