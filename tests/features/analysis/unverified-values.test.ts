import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { analyzeJoint } from "@/features/analysis/core/analyze";
import type { JointDesign } from "@/features/analysis/core/design";
import { getGasketTypeById } from "@/features/analysis/core/catalogue/gaskets";
import { isTaggedFromMemory, listUnverifiedValues } from "@/features/analysis/unverified-values";

// The list the approver acknowledges. Oracles are the catalogues' own tags (confidence "mem", the
// "from memory; verify" editions), never a judgement of the numbers themselves.
const example = (name: string): JointDesign =>
  JSON.parse(readFileSync(`examples/${name}.json`, "utf8")) as JointDesign;
const stored = (d: JointDesign) => JSON.parse(JSON.stringify(analyzeJoint(d))) as unknown;

describe("listUnverifiedValues", () => {
  it("names the compressed-fibre gasket's m and y and the ISO 4032 nut, with value and source", () => {
    const d = example("obround-manway");
    const list = listUnverifiedValues(d, stored(d));
    const byKey = new Map(list.map((v) => [v.key, v]));
    // catalogue/gaskets.ts: the compressed-fibre rows are "from memory; verify against Table 2-5.1".
    expect(byKey.get("catalogue:gaskets:compressed-fibre-1-8:m")).toMatchObject({
      value: "2",
      source: expect.stringContaining("from memory; verify against Table 2-5.1"),
    });
    expect(byKey.get("catalogue:gaskets:compressed-fibre-1-8:y")?.value).toBe("11 MPa (1600 psi)");
    // catalogue/nuts.ts: ISO 4032 across flats [mem]; M24 → s = 36 mm.
    expect(byKey.get("catalogue:nuts:iso-4032-M24")).toMatchObject({
      what: "Nut across flats (M24)",
      value: expect.stringContaining("36 mm"),
    });
    expect(new Set(list.map((v) => v.key)).size).toBe(list.length);
  });

  it("drops a value the designer replaced, and keeps the table's while it is unchanged", () => {
    const d = example("obround-manway");
    const row = getGasketTypeById("compressed-fibre-1-8")!;
    const own: JointDesign = {
      ...d,
      gasket: {
        ...d.gasket,
        material: {
          ...d.gasket.material,
          m: 2.4,
          yMpa: 12.5,
          modulusMpa: 1450,
          source: "maker's test report 2026-114",
        },
      },
    };
    const keys = listUnverifiedValues(own, stored(own)).map((v) => v.key);
    expect(keys.some((k) => k.startsWith("catalogue:gaskets:"))).toBe(
      // thickness still the catalogue's typical value
      own.gasket.material.thicknessMm === row.typicalThicknessMm,
    );
    expect(keys).not.toContain("catalogue:gaskets:compressed-fibre-1-8:m");
    expect(keys).not.toContain("catalogue:gaskets:compressed-fibre-1-8:y");
    expect(keys).not.toContain("catalogue:gaskets:compressed-fibre-1-8:modulus");
    expect(keys).not.toContain("document:gasket.material");
    // A replaced value whose own source says it is remembered is listed under the design's source.
    const remembered: JointDesign = {
      ...own,
      gasket: { ...own.gasket, material: { ...own.gasket.material, source: "colleague's figure [mem]" } },
    };
    expect(
      listUnverifiedValues(remembered, stored(remembered)).find((v) => v.key === "document:gasket.material"),
    ).toMatchObject({ value: "m 2.4, y 12.5 MPa", source: "colleague's figure [mem]" });
  });

  it("lists applicable checks that cite remembered tables, one entry per rule, never not-applicable ones", () => {
    const d = example("pipe-flange-nps6-spiral-wound");
    const result = stored(d) as { checks: { id: string; status: string; source: string }[] };
    const list = listUnverifiedValues(d, result);
    // The B16.5 rating check reads remembered rating tables (catalogue/pt-ratings.ts).
    expect(list.find((v) => v.key === "check:flange.rating")?.source).toContain("[mem]");
    const synthetic = {
      checks: [
        {
          id: "cover.c:x",
          title: "Cover factor",
          status: "not-applicable",
          source: "C = 0.3 [mem]",
          note: "",
        },
        {
          id: "edge.t:b1",
          title: "Edge",
          status: "pass",
          source: "rule [practice]",
          note: "Table row: 20.6 mm [mem].",
        },
        {
          id: "edge.t:b2",
          title: "Edge",
          status: "warn",
          source: "rule [practice]",
          note: "Table row: 20.6 mm [mem].",
        },
      ],
    };
    expect(listUnverifiedValues(d, synthetic).filter((v) => v.key.startsWith("check:"))).toEqual([
      { key: "check:edge.t", what: "Edge", value: "Table row: 20.6 mm [mem].", source: "rule [practice]" },
    ]);
    expect(list.filter((v) => v.key === "check:spacing.max-pitch")).toHaveLength(1);
  });

  it("is empty for no result, and reads an older result without editions or checks", () => {
    const d = example("obround-manway");
    expect(listUnverifiedValues(d, null)).toEqual([]);
    expect(listUnverifiedValues(d, { bolts: [] }).map((v) => v.key)).toEqual([
      "catalogue:gaskets:compressed-fibre-1-8:modulus",
      "catalogue:gaskets:compressed-fibre-1-8:thickness",
    ]);
  });

  it("reads the tags the catalogues and the core write", () => {
    expect(isTaggedFromMemory("ISO 4032 (from memory; verify)")).toBe(true);
    expect(isTaggedFromMemory("ASME VIII-1 UG-34(d)(2), sketch (j): C = 0.3 [mem]")).toBe(true);
    expect(isTaggedFromMemory("allowables [mem: verify against Section II-D]")).toBe(true);
    expect(isTaggedFromMemory("ASME B16.5 (edition not verified; values remembered) [mem]")).toBe(true);
    expect(isTaggedFromMemory("member stiffness from the frusta")).toBe(false);
    expect(isTaggedFromMemory("Table 2-5.1 as reproduced (edition not verified)")).toBe(false);
  });
});
