import { readFileSync } from "node:fs";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { createDesignFromFiles } from "@/features/imports/mutations";
import { getTestDb } from "../../setup/test-db";
import { orgWithUsersForSuite } from "../library/helpers";
import { countOrgRows } from "../../setup/suite-org";

// The Drawing intake's server side against the real PostgreSQL: a refused file stores nothing,
// and the layer and unit choices made in the browser are what the server reads.
const db = getTestDb();
const DIR = join(process.cwd(), "tests/fixtures/intake");
const bytes = (name: string) => new Uint8Array(readFileSync(join(DIR, name)));
const org = orgWithUsersForSuite("drawing-intake");
const designCount = () => countOrgRows("designs", org.organizationId);
const revisionCount = () => countOrgRows("design_revisions", org.organizationId);

describe("Drawing intake: create a design from files (real PostgreSQL)", () => {
  const viewer = () => ({
    organizationId: org.organizationId,
    userId: org.designerId,
    unitSystem: "US" as const,
  });

  it("stores nothing from a refused drawing or a refused CSV", async () => {
    const before = { designs: await designCount(), revisions: await revisionCount() };
    // R12 in inches read as millimetres: not a valid joint.
    const asMm = await createDesignFromFiles(db, viewer(), {
      fields: { name: "R12 cover", dxfUnit: "mm" },
      dxf: bytes("r12-inch-cover.dxf"),
      csv: null,
    });
    expect(asMm).toMatchObject({
      ok: false,
      fieldErrors: { design: [expect.stringMatching(/14 × 9.25 mm/)] },
    });
    // Every layer but the outline switched off: no holes.
    const noHoles = await createDesignFromFiles(db, viewer(), {
      fields: { name: "Sheet", layersOn: JSON.stringify(["OUTLINE"]) },
      dxf: bytes("layered-title-block.dxf"),
      csv: null,
    });
    expect(noHoles).toMatchObject({ ok: false, message: expect.stringMatching(/No bolt holes found/) });
    // A bolt CSV that is neither UTF-8 nor Windows-1252.
    const badCsv = await createDesignFromFiles(db, viewer(), {
      fields: { name: "Sheet" },
      dxf: bytes("layered-title-block.dxf"),
      csv: bytes("gaskets-undecodable.csv"),
    });
    expect(badCsv).toMatchObject({
      ok: false,
      fieldErrors: { csv: [expect.stringMatching(/neither UTF-8/)] },
    });
    const notDxf = await createDesignFromFiles(db, viewer(), {
      fields: { name: "Junk" },
      dxf: new TextEncoder().encode("not a drawing"),
      csv: null,
    });
    expect(notDxf.ok).toBe(false);
    expect({ designs: await designCount(), revisions: await revisionCount() }).toEqual(before);
  });

  it("creates the design in the unit and from the layers the user confirmed", async () => {
    const before = await designCount();
    const r = await createDesignFromFiles(db, viewer(), {
      fields: { name: "R12 cover", equipmentTag: "E-4471", dxfUnit: "in" },
      dxf: bytes("r12-inch-cover.dxf"),
      csv: null,
    });
    if (!r.ok) throw new Error(r.message);
    expect(await designCount()).toBe(before + 1);
    const rev = await db
      .selectFrom("design_revisions")
      .select("document")
      .where("design_id", "=", r.data.designId)
      .executeTakeFirstOrThrow();
    const doc = rev.document as {
      outline: { kind: string; points: { x: number; y: number }[] };
      bolts: unknown[];
    };
    const xs = doc.outline.points.map((p) => p.x);
    expect(Math.max(...xs) - Math.min(...xs)).toBeCloseTo(14 * 25.4, 6);
    expect(doc.bolts).toHaveLength(10);
  });
});
