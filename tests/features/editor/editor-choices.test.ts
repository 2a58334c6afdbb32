import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import {
  BOLT_MATERIALS,
  getStrengthForDiameter,
  stockedBoltMaterialRow,
} from "@/features/analysis/core/catalogue/bolt-materials";
import { FLANGE_MATERIALS } from "@/features/analysis/core/catalogue/flange-materials";
import {
  findThreadIn,
  rangeForDiameter,
  sortedStrengthRanges,
} from "@/features/analysis/core/catalogue/lookups";
import { THREADS, findThread } from "@/features/analysis/core/catalogue/threads";
import { TIGHTENING_METHODS } from "@/features/analysis/core/catalogue/tightening-methods";
import type { StockedBoltMaterial, ThreadSeries } from "@/features/analysis/core/design";
import { COVER_SKETCHES } from "@/features/analysis/core/flange-design/flat-cover";
import { buildEditorChoices } from "@/features/editor/model/editor-choices";
import { builtinGaskets } from "@/features/library/model/builtin-rows";

// The Joint data form reads its option lists from the server's "editor choices" instead of the
// catalogue tables: these tests hold the lists to the catalogue (ids, labels, order), so the form
// shows exactly what it showed when it read the tables itself.
const choices = buildEditorChoices();

describe("editor choices", () => {
  it("offers every thread, bolt material, flange material, cover sketch and tightening method in the catalogue's order", () => {
    const SERIES = { "metric-coarse": "metric coarse", unc: "UNC", "unified-8un": "8UN" };
    expect(choices.threads.map((t) => [t.value, t.label, t.nominalDiameterMm])).toEqual(
      THREADS.map((t) => [t.id, `${t.designation} (${SERIES[t.series]})`, t.nominalDiameterMm]),
    );
    expect(choices.boltMaterials.map((m) => [m.value, m.label])).toEqual(
      BOLT_MATERIALS.map((m) => [m.id, m.name]),
    );
    expect(choices.flangeMaterials).toEqual(FLANGE_MATERIALS.map((m) => ({ value: m.id, label: m.name })));
    expect(choices.coverSketches).toEqual(
      COVER_SKETCHES.map((s) => ({ value: s.id, label: `${s.label} — C = ${s.c}` })),
    );
    expect(choices.tighteningMethods.map((m) => [m.value, m.label])).toEqual(
      TIGHTENING_METHODS.map((m) => [m.id, m.name]),
    );
    expect(choices.tighteningMethods[0].hint).toBe(
      `Preload scatter ±30 % (${TIGHTENING_METHODS[0].source}; ${TIGHTENING_METHODS[0].edition})`,
    );
    expect(choices.builtinGaskets).toEqual(builtinGaskets());
  });

  it("finds a size by designation and series as the thread catalogue does (1 in is both 1-8UNC and 1-8UN)", () => {
    const series: ThreadSeries[] = ["metric-coarse", "unc", "unified-8un"];
    for (const designation of [...new Set(THREADS.map((t) => t.designation)), "M7", "9/16"])
      for (const s of series)
        expect(findThreadIn(choices.threads, designation, s)?.value, `${designation} ${s}`).toBe(
          findThread(designation, s)?.id,
        );
    expect(findThreadIn(choices.threads, "1", "unified-8un")?.value).toBe("1-8UNC");
  });

  it("looks up the allowable bolt stress of every catalogue material at every size as the catalogue does", () => {
    for (const row of BOLT_MATERIALS) {
      const choice = choices.boltMaterials.find((m) => m.value === row.id)!;
      for (const t of THREADS)
        expect(
          rangeForDiameter(choice.allowables, t.nominalDiameterMm).allowableMpa,
          `${row.id} ${t.id}`,
        ).toBe(getStrengthForDiameter(row, t.nominalDiameterMm).allowableMpa);
    }
    // At least one catalogue row has an allowable, so the comparison above is not all nulls.
    expect(choices.boltMaterials.some((m) => m.allowables.some((r) => r.allowableMpa !== null))).toBe(true);
  });

  it("looks up a Stockroom copy's allowable from its ranges in ascending order of size", () => {
    // Our own fictional row, ranges stored largest first; not published data.
    const stocked: StockedBoltMaterial = {
      name: "Shop stud grade X",
      modulusMpa: 200_000,
      ranges: [
        { maxDiameterMm: 100, proofMpa: null, yieldMpa: 600, tensileMpa: 800, allowableMpa: 150 },
        { maxDiameterMm: 24, proofMpa: null, yieldMpa: 700, tensileMpa: 900, allowableMpa: 170 },
      ],
      source: "our own test row",
      edition: "none",
    };
    const row = stockedBoltMaterialRow("org:x", stocked);
    for (const d of [12, 24, 30, 120])
      expect(rangeForDiameter(sortedStrengthRanges(stocked.ranges), d).allowableMpa).toBe(
        getStrengthForDiameter(row, d).allowableMpa,
      );
    expect(rangeForDiameter(sortedStrengthRanges(stocked.ranges), 20).allowableMpa).toBe(170);
  });

  it("leaves the form's client modules without a catalogue table import", () => {
    const tables =
      /catalogue\/(bolt-materials|threads|tightening-methods|flange-materials|gaskets)"|flat-cover"|builtin-rows"/;
    for (const file of [
      "features/editor/components/form-section-bolting.tsx",
      "features/editor/components/form-section-flange.tsx",
      "features/editor/components/form-section-assembly.tsx",
      "features/editor/components/form-section-gasket.tsx",
      "features/library/hooks/use-gasket-choices.ts",
    ]) {
      const imports = readFileSync(join(process.cwd(), file), "utf8")
        .split("\n")
        .filter((l) => /^import |^} from /.test(l));
      expect(
        imports.filter((l) => tables.test(l)),
        file,
      ).toEqual([]);
    }
  });
});
