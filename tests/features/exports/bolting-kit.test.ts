import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import type { JointDesign } from "@/features/analysis/core/design";
import { mmToIn } from "@/features/analysis/core/units";
import { buildBoltingKit, buildBoltingKitCsv } from "@/features/exports/model/bolting-kit";
import { exportFileName } from "@/features/exports/file-names";
import { renderSpacingSheet } from "@/features/exports/sheet/render-sheet";
import { boltingKitFor } from "@/features/exports/shop-files";
import { analyse, loadExample, pdfToText, sheetInputFor } from "./fixtures";

// The Bolting kit (bill of materials) of the example designs: one line per distinct item with its
// count, the stud length added up from the document's layers, washers and nut heights (worked by hand
// in each case below; nut heights are [mem] inputs), as CSV and as a section of the bolt-spacing sheet.
const flat = (s: string) => s.replace(/\s+/g, " ");

describe("Bolting kit of the example designs", () => {
  it("obround manway: 28 M24 studs of 180 mm (tensioner end 1·d), 56 nuts, 56 washers", () => {
    // Layers 45 + 3.2 + 50 = 98.2 mm, 2 washers of 4 mm, 2 nuts of 21.5 mm (ISO 4032 M24 [mem]),
    // 2 × 6 mm beyond the nuts, 18 mm more for the tensioner's puller: 179.2 → 180 mm.
    const design = loadExample("obround-manway");
    const kit = buildBoltingKit(design);
    expect(kit.lines.map((l) => [l.item, l.part, l.quantity])).toEqual([
      [1, "stud", 28],
      [2, "nut", 56],
      [3, "washer", 56],
    ]);
    expect(kit.length!.requiredMm).toBeCloseTo(179.2, 9);
    expect(kit.lines[0].lengthMm).toBe(180);
    expect(kit.lines[0].size).toBe("M24");
    expect(kit.lines[0].material).toBe("ASTM A193 grade B7 (Cr-Mo)");
    expect(kit.lines[1].material).toContain("ASTM A194 grade 2H");
    expect(kit.lines[0].basis).toContain("98.2 mm clamped layers + 2 × 4.0 mm washer + 2 × 21.5 mm nut");
    expect(kit.usesRememberedValues).toBe(true);
  });

  it("NPS 6 Class 150 pair (inches): 8 studs 3/4-10 UNC × 4 in, 16 heavy hex nuts, no washers", () => {
    // 54.1 mm = 2.130 in of layers, 2 × 47/64 in nuts [mem], 2 × 0.2 in beyond: 3.999 in → 4 in.
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const kit = buildBoltingKit(design);
    expect(kit.lines.map((l) => [l.part, l.quantity])).toEqual([
      ["stud", 8],
      ["nut", 16],
    ]);
    expect(kit.lines[0].size).toBe("3/4-10 UNC");
    expect(mmToIn(kit.lines[0].lengthMm!)).toBeCloseTo(4, 9);
    expect(kit.lines[1].description).toBe("Heavy hex nut, ASME B18.2.2");
    expect(kit.lines[1].size).toContain("across flats 1.250 in");
  });

  it("full-face cover: 20 M16 hex bolts of 75 mm, 20 nuts, 40 washers (under head and nut)", () => {
    // 20 + 3 + 25 = 48 mm, 2 × 3 mm washers, one 14.8 mm nut [mem], 4 mm beyond: 72.8 → 75 mm.
    const kit = buildBoltingKit(loadExample("rectangular-cover-full-face"));
    expect(kit.lines.map((l) => [l.part, l.quantity, l.lengthMm])).toEqual([
      ["bolt", 20, 75],
      ["nut", 20, null],
      ["washer", 40, null],
    ]);
    expect(kit.lines[1].material).toContain("ISO 898-2 property class 8");
  });
});

describe("Bolting kit CSV", () => {
  it("has the design's length unit, one row per item, and the unverified column", () => {
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const csv = boltingKitFor(design, analyse(design));
    const rows = parse(csv, { columns: true }) as Record<string, string>[];
    expect(Object.keys(rows[0])).toEqual([
      "item",
      "part",
      "description",
      "size",
      "length_in",
      "material",
      "quantity",
      "basis",
      "contains_unverified_table_values",
    ]);
    expect(rows.map((r) => [r.part, r.quantity, r.length_in])).toEqual([
      ["stud", "8", "4.000"],
      ["nut", "16", ""],
    ]);
    expect(csv.includes("\r\n")).toBe(true);
  });

  it("neutralises text cells a spreadsheet would run (the shared guard)", () => {
    const base = loadExample("rectangular-cover-full-face");
    const design: JointDesign = {
      ...base,
      fastener: { ...base.fastener, materialId: '=HYPERLINK("http://evil.example")' },
    };
    const rows = parse(buildBoltingKitCsv(design, buildBoltingKit(design)), { columns: true }) as Record<
      string,
      string
    >[];
    expect(rows[0].material).toBe('\'=HYPERLINK("http://evil.example")');
    expect(rows[1].material).toBe('a grade to suit =HYPERLINK("http://evil.example")');
    // Numbers stay numbers.
    expect(rows[0].length_mm).toBe("75.0");
  });

  it("is named like the other shop files", () => {
    expect(
      exportFileName(
        {
          equipmentTag: "E-2107",
          designName: "Channel cover",
          designId: "3f2a9c1e-5b7d-4c11-9e0a-2b6f8d4c7a10",
        },
        3,
        "bolting-kit",
      ),
    ).toBe("e-2107-channel-cover-3f2a9c1e-rev3-bolting-kit.csv");
  });
});

describe("Bolting kit on the bolt-spacing sheet (read back with pdftotext)", () => {
  it("prints the items with counts and lengths, how the length was added up, beside the cautions", async () => {
    const pdf = await renderSpacingSheet(sheetInputFor(loadExample("obround-manway")));
    const text = flat(pdfToText(pdf, { layout: true }));
    expect(text).toContain("BOLTING KIT");
    // One row per item: item, part, size, length, material, quantity (pdftotext keeps a row's first line together).
    expect(text).toContain("1 Stud bolt, threaded full M24 180.0 ASTM A193 grade B7 28");
    expect(text).toContain(
      "2 Hexagon nut, ISO 4032 M24, across flats 36.0 — ASTM A194 grade 2H 56 2 per stud",
    );
    expect(text).toMatch(/3 Flat washer OD 44\.0 mm × 4\.0 mm — hardened steel to suit 56 2 per stud/);
    expect(text).toContain("98.2 mm clamped layers + 2 × 4.0 mm washer");
    expect(text).toContain("2 threads beyond each nut [practice]");
    // The design enters 170 mm, shorter than the 179.2 mm the tensioned joint needs: said in words.
    expect(text).toContain(
      "The design's fastener length (170.0 mm) is shorter than the kit's worked length (179.2 mm, with the thread beyond the nuts and the tensioner's free thread)",
    );
    expect(text).toContain("Cautions");
  });

  it("follows the sheet's units, not the design's", async () => {
    const pdf = await renderSpacingSheet(
      sheetInputFor(loadExample("pipe-flange-nps6-spiral-wound"), { units: "SI" }),
    );
    const text = flat(pdfToText(pdf, { layout: true }));
    expect(text).toContain("1 Stud bolt, threaded full 3/4-10 UNC 101.6 ASTM A193 grade B7 8");
    expect(text).toContain("54.1 mm clamped layers + 2 × 18.7 mm nut");
    expect(text).not.toContain("is shorter than the kit's worked length");
  });
});
