import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import type { JointDesign } from "@/features/analysis/core/design";
import { buildCircularFlange } from "@/features/designs/model/templates";
import { toGasketMaterial } from "@/features/library/model/gasket-material";
import { createGasket, importLibraryCsv, setBuiltinHidden, updateGasket } from "@/features/library/mutations";
import {
  listBoltingChoices,
  listFlangeTemplateChoices,
  listGasketChoices,
  listGasketListing,
  listOwnGaskets,
} from "@/features/library/queries";
import { gasketInputSchema } from "@/features/library/schema";
import { gasketsToCsv } from "@/features/library/model/library-csv";
import { getTestDb } from "../../setup/test-db";
import { createOrgWithUsers, dropOrg, orgWithUsersForSuite } from "./helpers";

const db = getTestDb();

const gasketForm = (over: Record<string, string> = {}) =>
  gasketInputSchema.parse({
    name: "Halden Creek PTFE sheet 3 mm",
    gasket_type: "PTFE sheet",
    m: "2.5",
    y_mpa: "20",
    qmin_l01: "15",
    qsmin_l01: "10",
    qsmax_mpa: "120",
    pqr: "0.9",
    modulus_mpa: "900",
    thickness_mm: "3",
    source: "Supplier test report TR-4471",
    edition: "2026-03",
    ...over,
  });

describe("Stockroom (real PostgreSQL)", () => {
  const org = orgWithUsersForSuite("stockroom");
  const other = orgWithUsersForSuite("stockroom-other");

  it("merges built-in rows with the organisation's own rows and hides built-ins per organisation", async () => {
    const created = await createGasket(
      db,
      org.organizationId,
      org.adminId,
      gasketForm({ name: "Merge check gasket" }),
    );
    expect(created.ok).toBe(true);
    const choices = await listGasketChoices(db, org.organizationId);
    expect(choices[0]).toMatchObject({
      origin: "organization",
      name: "Merge check gasket",
      confidence: "organisation",
      tightness: { "L0.1": { qMinMpa: 15, qsMinMpa: 10 } },
    });
    expect(choices.some((c) => c.id === "builtin:spiral-wound-ss-fibre" && c.confidence === "pub2")).toBe(
      true,
    );

    expect(
      await setBuiltinHidden(db, org.organizationId, org.adminId, "gasket", "spiral-wound-ss-fibre", true),
    ).toBe(true);
    expect(
      (await listGasketChoices(db, org.organizationId)).some((c) => c.rowId === "spiral-wound-ss-fibre"),
    ).toBe(false);
    expect(
      (await listGasketListing(db, org.organizationId)).find((c) => c.rowId === "spiral-wound-ss-fibre")
        ?.hidden,
    ).toBe(true);
    // The other organisation neither sees our row nor our hidden list.
    const theirs = await listGasketChoices(db, other.organizationId);
    expect(theirs.some((c) => c.name === "Merge check gasket")).toBe(false);
    expect(theirs.some((c) => c.rowId === "spiral-wound-ss-fibre")).toBe(true);
    expect(await setBuiltinHidden(db, org.organizationId, org.adminId, "gasket", "no-such-row", true)).toBe(
      false,
    );

    expect((await listBoltingChoices(db, org.organizationId)).some((c) => c.rowId === "astm-a193-b7")).toBe(
      true,
    );
    expect(
      (await listFlangeTemplateChoices(db, org.organizationId)).some(
        (c) => c.rowId === "asme-b16.5-cl150-nps6",
      ),
    ).toBe(true);
  });

  it("refuses a second gasket with the same name (case-insensitive) with a field message", async () => {
    const again = await createGasket(
      db,
      org.organizationId,
      org.adminId,
      gasketForm({ name: "MERGE CHECK GASKET" }),
    );
    expect(again).toEqual({
      ok: false,
      message: expect.stringMatching(/already in the Stockroom/),
      fieldErrors: { name: [expect.any(String)] },
    });
  });

  it("editing a library row never changes a saved revision: the design embeds a copy of the values", async () => {
    const created = await createGasket(db, org.organizationId, org.adminId, gasketForm());
    if (!created.ok) throw new Error(created.message);
    const choice = (await listGasketChoices(db, org.organizationId)).find((c) => c.id === created.data.id)!;
    const base = buildCircularFlange(
      { name: "E-2107 channel cover", equipmentTag: "E-2107", units: "SI" },
      {
        outsideDiameterMm: 400,
        boreDiameterMm: 200,
        boltCircleDiameterMm: 340,
        boltCount: 12,
        boltSize: "M20",
        flangeThicknessMm: 30,
      },
    );
    const document: JointDesign = {
      ...base,
      gasket: { ...base.gasket, material: toGasketMaterial(choice, "L0.1") },
    };
    const design = await db
      .insertInto("designs")
      .values({
        organization_id: org.organizationId,
        name: document.name,
        outline_kind: "circle",
        owner_id: org.designerId,
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    const revision = await db
      .insertInto("design_revisions")
      .values({
        design_id: design.id,
        organization_id: org.organizationId,
        number: 1,
        status: "draft",
        document: JSON.stringify(document),
        created_by: org.designerId,
        last_edited_by: org.designerId,
      })
      .returning("id")
      .executeTakeFirstOrThrow();

    const edited = await updateGasket(
      db,
      org.organizationId,
      created.data.rowId,
      gasketForm({
        m: "3.75",
        y_mpa: "44",
        qmin_l01: "30",
        modulus_mpa: "1500",
        source: "Revised report TR-4471b",
      }),
    );
    expect(edited).toMatchObject({ ok: true, data: { m: 3.75, yMpa: 44 } });

    const stored = await db
      .selectFrom("design_revisions")
      .select("document")
      .where("id", "=", revision.id)
      .executeTakeFirstOrThrow();
    const material = (stored.document as JointDesign).gasket.material;
    expect(material).toEqual({
      name: "Halden Creek PTFE sheet 3 mm",
      catalogueId: created.data.id,
      m: 2.5,
      yMpa: 20,
      qMinMpa: 15,
      qsMinMpa: 10,
      qsMaxMpa: 120,
      modulusMpa: 900,
      thicknessMm: 3,
      source: "Supplier test report TR-4471; 2026-03",
    });
    // …while a new pick gets the edited values.
    const fresh = toGasketMaterial(
      (await listGasketChoices(db, org.organizationId)).find((c) => c.id === created.data.id)!,
    );
    expect(fresh).toMatchObject({ m: 3.75, yMpa: 44, qMinMpa: 30 });
  });

  it("CSV import with one bad row commits nothing and names the row and the field", async () => {
    const before = (await listOwnGaskets(db, org.organizationId)).length;
    const csv = [
      "name,gasket_type,m,y_mpa,modulus_mpa,thickness_mm,source,edition",
      "CSV ring A,graphite,2,15,1200,2,Report A,2026",
      "CSV ring B,graphite,2,abc,1200,2,Report B,2026",
      "CSV ring C,graphite,2,15,1200,2,Report C,2026",
    ].join("\n");
    const result = await importLibraryCsv(db, org.organizationId, org.adminId, "gasket", csv);
    expect(result.ok).toBe(false);
    if (result.ok) return;
    expect(result.message).toBe("Row 3, field y_mpa: must be a number. Nothing was imported.");
    expect(result.errors).toEqual([{ line: 3, field: "y_mpa", message: "must be a number" }]);
    expect(result.rows.map((r) => r.errors.length)).toEqual([0, 1, 0]);
    expect((await listOwnGaskets(db, org.organizationId)).length).toBe(before);

    // A row that is valid on its own but clashes with an existing name rolls back the rows before it.
    const clash = csv.replace("CSV ring B,graphite,2,abc", "Merge check gasket,graphite,2,15");
    const refused = await importLibraryCsv(db, org.organizationId, org.adminId, "gasket", clash);
    expect(refused).toMatchObject({
      ok: false,
      message:
        'Row 3, field name: a gasket with this name is already in the Stockroom; choose "update rows with the same name" to replace it. Nothing was imported.',
    });
    expect((await listOwnGaskets(db, org.organizationId)).length).toBe(before);

    const good = await importLibraryCsv(
      db,
      org.organizationId,
      org.adminId,
      "gasket",
      csv.replace(",abc,", ",15,"),
    );
    expect(good).toMatchObject({ ok: true, imported: 3 });
    expect((await listOwnGaskets(db, org.organizationId)).length).toBe(before + 3);
  });

  it("exports the organisation's own rows in the format the import reads (round trip into another organisation)", async () => {
    const own = await listOwnGaskets(db, org.organizationId);
    const csv = gasketsToCsv(own);
    expect(csv.split("\n")[0]).toBe(
      "name,gasket_type,m,y_mpa,qmin_l1,qsmin_l1,qmin_l01,qsmin_l01,qmin_l001,qsmin_l001,qsmax_mpa,pqr,eg_mpa,modulus_mpa,thickness_mm,source,edition",
    );
    expect(await importLibraryCsv(db, other.organizationId, other.adminId, "gasket", csv)).toMatchObject({
      ok: true,
      imported: own.length,
    });
    const strip = (rows: Awaited<ReturnType<typeof listOwnGaskets>>) =>
      rows.map(({ id: _i, rowId: _r, ...rest }) => rest);
    expect(strip(await listOwnGaskets(db, other.organizationId))).toEqual(strip(own));
  });

  it("neutralises formula cells in the export and reads its own export back unchanged (OWASP CSV injection)", async () => {
    const source = await createOrgWithUsers("stockroom-formula");
    const target = await createOrgWithUsers("stockroom-formula-target");
    try {
      const hostile = {
        name: "=cmd|' /C calc'!A0",
        gasket_type: "+SUM(1;2)",
        source: '@HYPERLINK("http://evil.example")',
        edition: "-2+3",
      };
      expect((await createGasket(db, source.organizationId, source.adminId, gasketForm(hostile))).ok).toBe(
        true,
      );
      const own = await listOwnGaskets(db, source.organizationId);
      const csv = gasketsToCsv(own);
      const [, cells] = parse(csv) as string[][];
      expect(cells.slice(0, 2)).toEqual(["'=cmd|' /C calc'!A0", "'+SUM(1;2)"]);
      expect(cells.slice(-2)).toEqual(['\'@HYPERLINK("http://evil.example")', "'-2+3"]);
      // Numeric columns stay numbers (m, y_mpa): nothing is prefixed there.
      expect(cells.slice(2, 4)).toEqual(["2.5", "20"]);
      expect(await importLibraryCsv(db, target.organizationId, target.adminId, "gasket", csv)).toMatchObject({
        ok: true,
        imported: 1,
      });
      const [back] = await listOwnGaskets(db, target.organizationId);
      expect(back).toMatchObject({
        name: hostile.name,
        gasketType: hostile.gasket_type,
        source: hostile.source,
        edition: hostile.edition,
      });
    } finally {
      await dropOrg(source.organizationId);
      await dropOrg(target.organizationId);
    }
  });

  it("imports bolting lines of one name as one material with its size ranges, and flange templates", async () => {
    const bolting = [
      "name,modulus_mpa,max_diameter_mm,proof_mpa,yield_mpa,tensile_mpa,allowable_mpa,source",
      "KR stud 42CrMo4,205000,39,,800,1000,,Mill certificate KR-17",
      "KR stud 42CrMo4,205000,16,,900,1100,,Mill certificate KR-17",
    ].join("\n");
    expect(await importLibraryCsv(db, org.organizationId, org.adminId, "bolting", bolting)).toMatchObject({
      ok: true,
      imported: 1,
    });
    const row = (await listBoltingChoices(db, org.organizationId)).find((b) => b.name === "KR stud 42CrMo4")!;
    expect(row.ranges.map((r) => r.maxDiameterMm)).toEqual([16, 39]);

    const flanges = [
      "standard,pressure_class,size,outside_diameter_mm,bolt_circle_diameter_mm,bolt_count,bolt_designation,bolt_diameter_mm,hole_diameter_mm,source",
      "EN 1092-1,PN 16,DN 150,285,240,8,M20,20,22,EN 1092-1 Table 8 (as entered by Kestrel Ridge)",
      "EN 1092-1,PN 16,DN 200,340,350,12,M20,20,22,EN 1092-1 Table 8",
    ].join("\n");
    const bad = await importLibraryCsv(db, org.organizationId, org.adminId, "flange", flanges);
    expect(bad).toMatchObject({
      ok: false,
      message:
        "Row 3, field bolt_circle_diameter_mm: must be smaller than the outside diameter. Nothing was imported.",
    });
    expect((await listFlangeTemplateChoices(db, org.organizationId)).some((f) => f.size === "DN 150")).toBe(
      false,
    );
  });
});
