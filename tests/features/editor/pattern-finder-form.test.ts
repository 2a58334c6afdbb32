/**
 * The Pattern finder's form to the search request: Stock to try (our Stockroom's rows or the
 * catalogue) to `materialIds` and `stockedBolting`, and the lengths typed in the desk's units to
 * the request's mm. Conversions: 1 in = 25.4 mm exactly (NIST SP 811, B.8); 1 psi = 6.894757 kPa
 * (NIST SP 811). The Stockroom row below is invented for the test (our own Stockroom data with
 * strengths of the order of an ASTM A193 B7 stud, values from memory, not an oracle of strength).
 */
import { describe, expect, it } from "vitest";
import type { BoltingChoiceDto } from "@/features/library/model/dto";
import { suggestPatterns } from "@/features/analysis/core/suggest/search";
import { checkSuggestionRequest } from "@/features/analysis/core/suggest/request";
import { getBoltPathLengthMm } from "@/features/analysis/core/geometry";
import {
  cardLength,
  finderLengthsToMm,
  initialFinderLengths,
  pathLengthText,
  type FinderLengths,
} from "@/features/editor/model/finder-lengths";
import {
  catalogueChoices,
  stockOfRequest,
  stockroomChoices,
  strengthText,
} from "@/features/editor/model/finder-stock";
import { circularFlange, rectangularCover } from "../analysis/core/fixtures";

const OWN_UUID = "00000000-0000-4000-8000-000000000019";
const own: BoltingChoiceDto = {
  id: `org:${OWN_UUID}`,
  origin: "organization",
  rowId: OWN_UUID,
  source: "Kestrel Ridge stores certificate KR-B-19 (demo data)",
  edition: "2026",
  confidence: "organisation",
  hidden: false,
  name: "Halden Creek B7 stud stock",
  modulusMpa: 199_000,
  ranges: [
    { maxDiameterMm: 100, proofMpa: null, yieldMpa: 720, tensileMpa: 860, allowableMpa: 172 },
    { maxDiameterMm: 64, proofMpa: null, yieldMpa: 725, tensileMpa: 862, allowableMpa: 172.4 },
  ],
  allowableSource: null,
};
const builtin: BoltingChoiceDto = {
  ...own,
  id: "builtin:iso-898-1-8.8",
  origin: "builtin",
  rowId: "iso-898-1-8.8",
  confidence: "pub2",
  name: "ISO 898-1 property class 8.8",
};

describe("Stock to try → the request's materials", () => {
  it("our own row goes as stockedBolting under its org id with its stored values, a built-in row as its catalogue id", () => {
    const rows = [builtin, own];
    expect(stockroomChoices(rows).map((c) => [c.searchId, c.ours])).toEqual([
      ["iso-898-1-8.8", false],
      [`org:${OWN_UUID}`, true],
    ]);
    const part = stockOfRequest("stockroom", rows, new Set(["iso-898-1-8.8", `org:${OWN_UUID}`]));
    expect(part.materialIds).toEqual(["iso-898-1-8.8", `org:${OWN_UUID}`]);
    expect(part.stockedBolting).toEqual([
      {
        id: `org:${OWN_UUID}`,
        material: {
          name: own.name,
          modulusMpa: 199_000,
          // as stored, in ascending order of size
          ranges: [own.ranges[1], own.ranges[0]],
          source: own.source,
          edition: "2026",
        },
      },
    ]);
  });

  it("unticked rows are not sent; the catalogue sends its own ids and never a Stockroom row", () => {
    expect(stockOfRequest("stockroom", [builtin, own], new Set([`org:${OWN_UUID}`]))).toMatchObject({
      materialIds: [`org:${OWN_UUID}`],
    });
    expect(stockOfRequest("stockroom", [builtin, own], new Set(["iso-898-1-8.8"]))).toEqual({
      materialIds: ["iso-898-1-8.8"],
    });
    const catalogue = stockOfRequest("catalogue", [own], new Set([`org:${OWN_UUID}`, "astm-a193-b7"]));
    expect(catalogue).toEqual({ materialIds: ["astm-a193-b7"] });
    expect(catalogueChoices().every((c) => !c.ours)).toBe(true);
  });

  it("a search limited to our own row names it, and each candidate's fastener carries the row's values", () => {
    // The 3/4 in B7-like case of tests/features/analysis/core/suggest-stocked.test.ts.
    const design = circularFlange({ boltCount: 8, flangeThicknessMm: 40 });
    const request = {
      design,
      sizes: [{ designation: "3/4", threadSeries: "unc" as const }],
      allowLayoutWarnings: true,
      ...stockOfRequest("stockroom", [builtin, own], new Set([`org:${OWN_UUID}`])),
    };
    expect(checkSuggestionRequest(request)).toEqual([]);
    const result = suggestPatterns(request);
    expect(result.candidates.length).toBeGreaterThan(0);
    for (const c of result.candidates) {
      expect(c.materialName).toBe(own.name);
      expect(c.design.fastener.materialId).toBe(`org:${OWN_UUID}`);
      expect(c.design.fastener.stockedMaterial).toEqual(request.stockedBolting![0].material);
    }
  });

  it("each row shows its strengths over its size ranges, in the desk's stress unit", () => {
    expect(strengthText(catalogueChoices().find((c) => c.searchId === "iso-898-1-8.8")!.ranges, "SI")).toBe(
      // ISO 898-1 Table 3, class 8.8: Rp0.2 640/660 MPa, Rm 800/830 MPa (d ≤ 16 / d > 16)
      "Sy 640–660 · Su 800–830 MPa",
    );
    // 640 MPa / 0.006894757 = 92 824 psi; 830 MPa = 120 381 psi (3 significant digits)
    expect(strengthText(builtin.ranges, "US")).toBe("Sy 104000–105000 · Su 125000 psi");
    expect(strengthText(catalogueChoices()[0].ranges, "US")).toMatch(
      /^Sy 92800–95700 · Su 116000–120000 psi$/,
    );
  });
});

const form = (patch: Partial<FinderLengths>): FinderLengths => ({
  ...initialFinderLengths(rectangularCover(), "SI"),
  ...patch,
});

describe("Path rules' lengths in the desk's units → mm", () => {
  const design = rectangularCover(); // offset path 25 mm inward
  const L = getBoltPathLengthMm(design);

  it("opens in mm as before: the design's offset ±5 mm in steps of 5 mm, no keep-out, no extra clearance", () => {
    expect(initialFinderLengths(design, "SI")).toEqual({
      tryOffsets: false,
      offsetFrom: "20",
      offsetTo: "30",
      offsetStep: "5",
      keepOuts: [],
      clearance: "0",
    });
  });

  it("opens in inches on a US desk: 25 mm = 0.984 in, ±0.25 in rounded to 0.05 in", () => {
    expect(initialFinderLengths(design, "US")).toMatchObject({
      offsetFrom: "0.75",
      offsetTo: "1.25",
      offsetStep: "0.25",
    });
    expect(cardLength(25.4, "US")).toBe("1.000");
    expect(cardLength(25.4, "SI")).toBe("25.4");
    expect(pathLengthText(design, "US")).toBe(`${(L / 25.4).toFixed(3)} in`);
  });

  it("inches typed are sent as mm (1 in = 25.4 mm); SI values pass unchanged", () => {
    const typed = {
      tryOffsets: true,
      offsetFrom: "1",
      offsetTo: "1.25",
      offsetStep: "0.25",
      keepOuts: [{ from: "2", to: "4.5", label: " nozzle N2 " }],
      clearance: "0.5",
    };
    expect(finderLengthsToMm(design, typed, "US")).toEqual({
      ok: true,
      value: {
        offsetRangeMm: { fromMm: 25.4, toMm: 31.75, stepMm: 6.35 },
        keepOuts: [{ kind: "arc-length", fromMm: 50.8, toMm: 114.3, label: "nozzle N2" }],
        minToolClearanceMm: 12.7,
      },
    });
    expect(
      finderLengthsToMm(design, { ...typed, keepOuts: [{ from: "50", to: "120", label: "" }] }, "SI"),
    ).toMatchObject({
      ok: true,
      value: { keepOuts: [{ kind: "arc-length", fromMm: 50, toMm: 120 }], minToolClearanceMm: 0.5 },
    });
  });

  it("offsets are not sent unless tried", () => {
    expect(finderLengthsToMm(design, form({ tryOffsets: false, offsetFrom: "x" }), "SI")).toMatchObject({
      ok: true,
      value: { offsetRangeMm: null },
    });
  });

  it("a bad length is named in the unit typed and nothing is sent", () => {
    const r = finderLengthsToMm(
      design,
      form({ keepOuts: [{ from: "abc", to: String(L / 25.4 + 1), label: "" }], clearance: "9" }),
      "US",
    );
    expect(r.ok).toBe(false);
    if (r.ok) return;
    expect(r.messages[0]).toBe("Keep-out 1 from must be a number.");
    expect(r.messages[1]).toMatch(/^Keep-out 1 to must be at most [\d.]+ in\.$/);
    // the search's limit of 200 mm extra clearance = 7.874 in
    expect(r.messages[2]).toBe("Tool clearance must be at most 7.874 in.");
  });

  it("the path length as the heading shows it (rounded) is the end of the path", () => {
    const shown = pathLengthText(design, "US").split(" ")[0];
    const r = finderLengthsToMm(design, form({ keepOuts: [{ from: "0", to: shown, label: "" }] }), "US");
    expect(r).toMatchObject({ ok: true });
    if (r.ok) expect(r.value.keepOuts![0]).toMatchObject({ fromMm: 0 });
    if (r.ok) expect(Math.abs((r.value.keepOuts![0] as { toMm: number }).toMm - L)).toBeLessThan(0.02);
  });
});
