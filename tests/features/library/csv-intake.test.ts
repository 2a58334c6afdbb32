import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import {
  boltingToCsv,
  flangesToCsv,
  gasketsToCsv,
  parseLibraryCsv,
} from "@/features/library/model/library-csv";
import { importLibraryCsv, planLibraryImport } from "@/features/library/mutations";
import { listOwnBolting, listOwnFlangeTemplates, listOwnGaskets } from "@/features/library/queries";
import { getTestDb } from "../../setup/test-db";
import { orgWithUsersForSuite } from "./helpers";

// The Stockroom's CSV intake against the real PostgreSQL: files as spreadsheets write them
// (fixtures from tests/fixtures/intake/generate-fixtures.ts), refusals that store nothing, the
// "update rows with the same name" re-import, and the round trip of all three exports.
const db = getTestDb();
const DIR = join(process.cwd(), "tests/fixtures/intake");
const bytes = (name: string) => new Uint8Array(readFileSync(join(DIR, name)));
const manifest = JSON.parse(readFileSync(join(DIR, "manifest.json"), "utf8"));

async function counts(organizationId: string) {
  return {
    gaskets: (await listOwnGaskets(db, organizationId)).length,
    bolting: (await listOwnBolting(db, organizationId)).length,
    flanges: (await listOwnFlangeTemplates(db, organizationId)).length,
  };
}
const strip = <T extends { id: string; rowId: string }>(rows: T[]) =>
  rows.map(({ id: _i, rowId: _r, ...rest }) => rest);

const BOLTING = [
  "name,modulus_mpa,max_diameter_mm,proof_mpa,yield_mpa,tensile_mpa,allowable_mpa,source,edition",
  "Halden B7 stud,205000,64,,725,860,172,Mill certificate HC-7,2026",
  "Halden B7 stud,205000,100,,655,795,,Mill certificate HC-7,2026",
  "Halden L7 stud,205000,64,,725,860,,Mill certificate HC-8,",
].join("\n");
const FLANGES = [
  "standard,pressure_class,size,outside_diameter_mm,bore_diameter_mm,bolt_circle_diameter_mm,bolt_count,bolt_designation,bolt_diameter_mm,hole_diameter_mm,source,edition",
  "EN 1092-1,PN 16,DN 150,285,,240,8,M20,20,22,EN 1092-1 Table 8 (as entered by Kestrel Ridge),2018",
].join("\n");

describe("Stockroom CSV intake as spreadsheets write it (real PostgreSQL)", () => {
  const org = orgWithUsersForSuite("csv-intake");
  const other = orgWithUsersForSuite("csv-intake-other");

  it("stores a Windows-1252 file's °, µ and en dash exactly, and exports them as UTF-8", async () => {
    const r = await importLibraryCsv(
      db,
      org.organizationId,
      org.adminId,
      "gasket",
      bytes("gaskets-windows-1252.csv"),
    );
    expect(r).toMatchObject({ ok: true, imported: 1 });
    const row = (await listOwnGaskets(db, org.organizationId)).find(
      (g) => g.name === manifest["gaskets-windows-1252.csv"].name,
    );
    expect(row?.source).toBe(manifest["gaskets-windows-1252.csv"].source);
    const exported = gasketsToCsv(await listOwnGaskets(db, org.organizationId));
    expect(exported).toContain("Graphite 23 °C");
    expect(exported).not.toContain("\uFFFD");
  });

  it("stores the semicolon, decimal-comma file's numbers as numbers", async () => {
    const r = await importLibraryCsv(
      db,
      org.organizationId,
      org.adminId,
      "gasket",
      bytes("gaskets-semicolon-decimal-comma.csv"),
    );
    expect(r).toMatchObject({ ok: true, imported: 2 });
    const rows = await listOwnGaskets(db, org.organizationId);
    const g = rows.find((x) => x.name === "Halden graphite sheet 2,0")!;
    expect(g).toMatchObject({
      m: 2.5,
      yMpa: 20.7,
      modulusMpa: 1200,
      thicknessMm: 2,
      source: "Maker sheet HG-2; table 3",
    });
  });

  it("a refused file stores nothing in any Stockroom table", async () => {
    const before = await counts(org.organizationId);
    for (const name of ["gaskets-undecodable.csv", "gaskets-replacement-char.csv"]) {
      const r = await importLibraryCsv(db, org.organizationId, org.adminId, "gasket", bytes(name));
      expect(r.ok).toBe(false);
      if (r.ok) continue;
      expect(r.message).toMatch(/Nothing was imported\.$/);
    }
    // A valid first row followed by an undecodable file body: still nothing.
    const mixed = new Uint8Array([
      ...new TextEncoder().encode(
        "name,gasket_type,m,y_mpa,modulus_mpa,thickness_mm,source\nGood ring,graphite,2,15,1000,2,x\nBad ",
      ),
      0x81,
      ...new TextEncoder().encode(" ring,graphite,2,15,1000,2,x\n"),
    ]);
    expect((await importLibraryCsv(db, org.organizationId, org.adminId, "gasket", mixed)).ok).toBe(false);
    expect(await counts(org.organizationId)).toEqual(before);
    const names = (await listOwnGaskets(db, org.organizationId)).map((g) => g.name);
    expect(names.some((n) => n.includes("\uFFFD"))).toBe(false);
    expect(names).not.toContain("Good ring");
  });

  it("re-importing the Stockroom's own export: 'add new' refuses with the way out, 'update' updates", async () => {
    const own = await listOwnGaskets(db, org.organizationId);
    const csv = gasketsToCsv(own, "spreadsheet");
    expect(csv.startsWith("\uFEFF")).toBe(true);
    expect(csv.split("\r\n").length).toBe(own.length + 2);
    const add = await importLibraryCsv(db, org.organizationId, org.adminId, "gasket", csv);
    expect(add).toMatchObject({
      ok: false,
      message: expect.stringMatching(/already in the Stockroom; choose "update rows with the same name"/),
    });
    const edited = csv.replace("Graphite 23 °C,graphite-sheet,2,20", "Graphite 23 °C,graphite-sheet,2.25,20");
    const parsed = parseLibraryCsv("gasket", edited);
    if (!parsed.ok) throw new Error(parsed.message);
    const plan = await planLibraryImport(db, org.organizationId, "gasket", parsed, "update");
    expect(plan).toMatchObject({ ok: true, plan: { added: 0, updated: own.length } });
    const up = await importLibraryCsv(db, org.organizationId, org.adminId, "gasket", edited, "update");
    expect(up).toMatchObject({ ok: true, imported: own.length, plan: { added: 0, updated: own.length } });
    const after = await listOwnGaskets(db, org.organizationId);
    expect(after.map((g) => g.id).sort()).toEqual(own.map((g) => g.id).sort());
    expect(after.find((g) => g.name === "Graphite 23 °C")?.m).toBe(2.25);
  });

  it("bolting: two ranges of one name preview as 2 lines and are planned, and committed, as 1 material", async () => {
    const parsed = parseLibraryCsv("bolting", BOLTING);
    if (!parsed.ok) throw new Error(parsed.message);
    expect(parsed.rows).toHaveLength(3);
    const planned = await planLibraryImport(db, org.organizationId, "bolting", parsed, "add");
    if (!planned.ok) throw new Error(planned.message);
    expect(planned.plan).toMatchObject({
      added: 2,
      updated: 0,
      merged: [{ label: "Halden B7 stud", lines: [2, 3] }],
    });
    expect(planned.plan.summary).toBe(
      "3 lines read (comma-separated, UTF-8): 2 bolting materials to add, 0 to update; lines 2 and 3 (Halden B7 stud) become 1 bolting material with 2 size ranges.",
    );
    expect(await importLibraryCsv(db, org.organizationId, org.adminId, "bolting", BOLTING)).toMatchObject({
      ok: true,
      imported: 2,
    });
  });

  it("round trip of every Stockroom export (plain and spreadsheet variants) through the intake", async () => {
    expect(await importLibraryCsv(db, org.organizationId, org.adminId, "flange", FLANGES)).toMatchObject({
      ok: true,
    });
    const sources = {
      gasket: await listOwnGaskets(db, org.organizationId),
      bolting: await listOwnBolting(db, org.organizationId),
      flange: await listOwnFlangeTemplates(db, org.organizationId),
    };
    for (const variant of ["plain", "spreadsheet"] as const) {
      const files = {
        gasket: gasketsToCsv(sources.gasket, variant),
        bolting: boltingToCsv(sources.bolting, variant),
        flange: flangesToCsv(sources.flange, variant),
      };
      for (const kind of ["gasket", "bolting", "flange"] as const) {
        // Into the same organisation: every row updates to the same values.
        const same = await importLibraryCsv(db, org.organizationId, org.adminId, kind, files[kind], "update");
        expect(same).toMatchObject({ ok: true, plan: { added: 0, updated: sources[kind].length } });
        // Into another organisation (as bytes, as the browser sends them): added, then updated.
        const enc = new TextEncoder().encode(files[kind]);
        const mode = variant === "plain" ? "add" : "update";
        const into = await importLibraryCsv(db, other.organizationId, other.adminId, kind, enc, mode);
        expect(into).toMatchObject({ ok: true });
      }
    }
    expect(strip(await listOwnGaskets(db, org.organizationId))).toEqual(strip(sources.gasket));
    expect(strip(await listOwnBolting(db, org.organizationId))).toEqual(strip(sources.bolting));
    expect(strip(await listOwnFlangeTemplates(db, org.organizationId))).toEqual(strip(sources.flange));
    expect(strip(await listOwnGaskets(db, other.organizationId))).toEqual(strip(sources.gasket));
    expect(strip(await listOwnBolting(db, other.organizationId))).toEqual(strip(sources.bolting));
    expect(strip(await listOwnFlangeTemplates(db, other.organizationId))).toEqual(strip(sources.flange));
  });
});
