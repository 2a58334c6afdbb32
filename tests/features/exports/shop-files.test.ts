import { parse } from "csv-parse/sync";
import DxfParser from "dxf-parser";
import { describe, expect, it } from "vitest";
import type { JointDesign } from "@/features/analysis/core/design";
import { getBoltPoints } from "@/features/analysis/core/geometry";
import { MM_PER_IN } from "@/features/analysis/core/units";
import { exportFileName } from "@/features/exports/file-names";
import { listUnverifiedValues } from "@/features/analysis/unverified-values";
import { drillingTemplateFor, holeListFor } from "@/features/exports/shop-files";
import { parseDxfFlange } from "@/features/imports/model/parse-dxf-flange";
import { dxfText } from "@/features/exports/model/drilling-notes";
import { CAUTIONS } from "@/features/ui/cautions";
import { analyse, EXPORTED_AT, loadExample, manyBoltFlange, revisionFactsFor } from "./fixtures";

// The hole list (CSV) and the drilling template (DXF) parsed back with the well-kept readers,
// every hole compared with the core's own bolt positions to 0.001 mm.
const TOL_MM = 0.001;

const cases: [string, JointDesign][] = [
  ["NPS 6 pipe flange (US units, inches)", loadExample("pipe-flange-nps6-spiral-wound")],
  ["obround manway (mm)", loadExample("obround-manway")],
  ["full-face rectangular cover (mm)", loadExample("rectangular-cover-full-face")],
  ["96-bolt girth flange (mm)", manyBoltFlange(96)],
];

describe.each(cases)("shop files of the %s", (_label, design) => {
  const result = analyse(design);
  const expected = getBoltPoints(design);
  const inches = design.units === "US";
  const k = inches ? MM_PER_IN : 1;
  const unit = inches ? "in" : "mm";

  it("hole list: a header naming the unit and every hole at its coordinates", () => {
    const csv = holeListFor(design, result);
    const rows = parse(csv, { columns: true, skip_empty_lines: true }) as Record<string, string>[];
    expect(Object.keys(rows[0])).toEqual([
      "number",
      "id",
      "angle_deg_cw_from_top",
      `x_${unit}`,
      `y_${unit}`,
      `hole_diameter_${unit}`,
      "bolt_size",
      "tightening_order",
      // Every case here keeps a catalogue value from memory (the ISO 4032 nuts, the TEMA D-5 rows).
      ...(listUnverifiedValues(design, result).length > 0 ? ["contains_unverified_table_values"] : []),
    ]);
    expect(rows).toHaveLength(design.bolts.length);
    rows.forEach((row, i) => {
      expect(row.number).toBe(String(i + 1));
      expect(row.id).toBe(design.bolts[i].id);
      expect(Math.abs(Number(row[`x_${unit}`]) * k - expected[i].x)).toBeLessThan(TOL_MM);
      expect(Math.abs(Number(row[`y_${unit}`]) * k - expected[i].y)).toBeLessThan(TOL_MM);
      expect(
        Math.abs(Number(row[`hole_diameter_${unit}`]) * k - design.fastener.holeDiameterMm),
      ).toBeLessThan(TOL_MM);
      expect(row.bolt_size).toBe(design.fastener.designation);
    });
    // The tightening order is the stored plan's sequence, each position used once.
    const order = rows.map((r) => Number(r.tightening_order)).sort((a, b) => a - b);
    expect(order).toEqual(Array.from({ length: design.bolts.length }, (_, i) => i + 1));
    expect(rows.find((r) => r.tightening_order === "1")?.id).toBe(result.assemblyPlan.sequence[0]);
  });

  it("drilling template: named layers, $INSUNITS, one circle per hole at its coordinates and diameter", () => {
    const dxf = new DxfParser().parseSync(
      drillingTemplateFor(design, result, revisionFactsFor(design), EXPORTED_AT),
    );
    expect(dxf).not.toBeNull();
    const header = dxf!.header as Record<string, unknown>;
    expect(header.$INSUNITS).toBe(inches ? 1 : 4);
    const layers = Object.keys((dxf!.tables as { layer: { layers: Record<string, unknown> } }).layer.layers);
    for (const name of ["OUTLINE", "BORE", "HOLES", "CENTRE-MARKS", "BOLT-PATH", "GASKET"]) {
      if (name === "BORE" && !design.bore) continue;
      if (name === "GASKET" && design.gasket.kind !== "ring") continue;
      expect(layers).toContain(name);
    }
    const entities = dxf!.entities as {
      type: string;
      layer: string;
      center?: { x: number; y: number };
      radius?: number;
    }[];
    const holes = entities.filter((e) => e.type === "CIRCLE" && e.layer === "HOLES");
    expect(holes).toHaveLength(design.bolts.length);
    for (const p of expected) {
      const hit = holes.filter((h) => Math.hypot(h.center!.x * k - p.x, h.center!.y * k - p.y) < TOL_MM);
      expect(hit).toHaveLength(1);
      expect(Math.abs(hit[0].radius! * k * 2 - design.fastener.holeDiameterMm)).toBeLessThan(TOL_MM);
    }
    expect(entities.filter((e) => e.type === "LINE" && e.layer === "CENTRE-MARKS")).toHaveLength(
      2 * design.bolts.length,
    );
    expect(entities.some((e) => e.layer === "OUTLINE")).toBe(true);
    expect(entities.some((e) => e.layer === "BOLT-PATH")).toBe(true);
  });
});

describe("export file names", () => {
  const ID = "3f2a9c1e-5b7d-4c11-9e0a-2b6f8d4c7a10";
  const OTHER = "8c01d2e3-0000-4000-8000-000000000001";
  it("use the equipment tag, the design name and the start of the design id, with the revision and the kind", () => {
    expect(
      exportFileName(
        { equipmentTag: "E-2107", designName: "Channel cover", designId: ID },
        3,
        "spacing-sheet",
      ),
    ).toBe("e-2107-channel-cover-3f2a9c1e-rev3-spacing-sheet.pdf");
    // A name that starts with the tag does not repeat it.
    expect(
      exportFileName(
        { equipmentTag: "E-2107", designName: "E-2107 inlet nozzle N1", designId: ID },
        1,
        "hole-list",
      ),
    ).toBe("e-2107-inlet-nozzle-n1-3f2a9c1e-rev1-hole-list.csv");
    // Two designs of one tag and even of one name get two names.
    const same = { equipmentTag: "E-2107", designName: "E-2107 channel cover" };
    expect(exportFileName({ ...same, designId: ID }, 1, "hole-list")).not.toBe(
      exportFileName({ ...same, designId: OTHER }, 1, "hole-list"),
    );
    expect(
      exportFileName({ equipmentTag: " ", designName: "Manway M1 / north", designId: ID }, 12, "hole-list"),
    ).toBe("manway-m1-north-3f2a9c1e-rev12-hole-list.csv");
    expect(
      exportFileName({ equipmentTag: "", designName: "Flänge ½", designId: ID }, 1, "drilling-template"),
    ).toBe("flange-1-2-3f2a9c1e-rev1-drilling-template.dxf");
    expect(exportFileName({ equipmentTag: "", designName: "Ø", designId: ID }, 2, "hole-list")).toBe(
      "design-3f2a9c1e-rev2-hole-list.csv",
    );
  });
});

describe("drilling template: hole callouts and title block", () => {
  type TextEntity = { type: string; layer: string; text?: string };
  const textsOn = (dxfText: string, layer: string) =>
    (new DxfParser().parseSync(dxfText)!.entities as TextEntity[])
      .filter((e) => e.type === "TEXT" && e.layer === layer)
      .map((e) => e.text ?? "");

  it("NPS 6 (inches): '8 X Ø0.8750 IN THRU … ON PCD Ø9.5000 IN', hole 1's angle, a table of every hole", () => {
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const dxf = drillingTemplateFor(design, analyse(design), revisionFactsFor(design), EXPORTED_AT);
    const notes = textsOn(dxf, "HOLE-NOTES");
    // %%C is DXF's diameter sign. 7/8 in holes on the 9-1/2 in bolt circle (ASME B16.5 Class 150 NPS 6).
    expect(notes[0]).toBe("8 X %%C0.8750 IN THRU FOR 3/4 IN BOLTS ON PCD %%C9.5000 IN, EQUALLY SPACED");
    expect(notes[1]).toBe("HOLE 1 AT 22.50 DEG CLOCKWISE FROM TOP");
    expect(notes).toContain("HOLE   X IN   Y IN   ANGLE DEG");
    const expected = getBoltPoints(design);
    for (let i = 0; i < 8; i++) {
      const row = notes.find((t) => t.startsWith(`${i + 1}   `))!;
      const [, x, y] = row.split(/\s+/).map(Number);
      expect(Math.abs(x * MM_PER_IN - expected[i].x)).toBeLessThan(TOL_MM);
      expect(Math.abs(y * MM_PER_IN - expected[i].y)).toBeLessThan(TOL_MM);
    }
  });

  it("a cover on an offset bolt path says so and tables the positions", () => {
    const design = loadExample("obround-manway");
    const notes = textsOn(
      drillingTemplateFor(design, analyse(design), revisionFactsFor(design), EXPORTED_AT),
      "HOLE-NOTES",
    );
    expect(notes[0]).toBe("28 X %%C27.00 MM THRU FOR M24 BOLTS ON THE BOLT PATH 40.00 MM INSIDE THE OUTLINE");
    expect(notes.filter((t) => /^\d+ {3}-?\d/.test(t))).toHaveLength(28);
  });

  it("title block: design, tag, revision, status, approval with the approver, date, the mark and every caution", () => {
    const design = loadExample("pipe-flange-nps6-spiral-wound");
    const result = analyse(design);
    const title = textsOn(
      drillingTemplateFor(design, result, revisionFactsFor(design), EXPORTED_AT),
      "TITLE",
    );
    expect(title[0]).toBe("SEALPITCH DRILLING TEMPLATE");
    expect(title).toContain(`DESIGN: ${design.name}   TAG: E-2107`);
    expect(title).toContain("REVISION: 7   STATUS: APPROVED");
    expect(title).toContain("APPROVED: 2026-11-30 BY ARLO APPROVER");
    expect(title).toContain("DATE: 2026-12-01 (EXPORTED)   UNITS: IN, SCALE 1:1");
    expect(listUnverifiedValues(design, result).length).toBeGreaterThan(0);
    expect(title).toContain("CONTAINS UNVERIFIED TABLE VALUES");
    for (const c of CAUTIONS) expect(title).toContain(`- ${c.replace(/[\u2010-\u2015]/g, "-")}`);
    // A draft names no approver and says it is not approved.
    const draft = textsOn(
      drillingTemplateFor(design, result, revisionFactsFor(design, "draft"), EXPORTED_AT),
      "TITLE",
    );
    expect(draft).toContain("REVISION: 7   STATUS: DRAFT - NOT APPROVED");
    expect(draft).toContain("APPROVER: NONE - THIS REVISION IS NOT APPROVED");
    expect(draft.join(" ")).not.toContain("ARLO");
    // The frame of the block is on the TITLE layer too.
    const parsed = new DxfParser().parseSync(
      drillingTemplateFor(design, result, revisionFactsFor(design), EXPORTED_AT),
    )!;
    expect((parsed.entities as TextEntity[]).some((e) => e.layer === "TITLE" && e.type !== "TEXT")).toBe(
      true,
    );
  });

  it("writes text as ASCII with DXF's control codes for Ø, °, ± and %", () => {
    expect(dxfText("Flänge Ø500 at 45° ±1 % — “A”")).toBe('Flange %%C500 at 45%%D %%P1 %%% - "A"');
    expect(dxfText("日本")).toBe("??");
  });

  it("stays a drawing our own Drawing intake reads back: notes and title off, every hole where it was", () => {
    for (const design of [loadExample("obround-manway"), manyBoltFlange(96)]) {
      const dxf = drillingTemplateFor(design, analyse(design), revisionFactsFor(design), EXPORTED_AT);
      const read = parseDxfFlange(dxf);
      expect(read.ok).toBe(true);
      if (!read.ok) continue;
      const off = read.value.reading.layers.filter((l) => !l.on).map((l) => l.name);
      expect(off).toEqual(expect.arrayContaining(["HOLE-NOTES", "TITLE"]));
      expect(read.value.boltHoles).toHaveLength(design.bolts.length);
    }
  });
});
