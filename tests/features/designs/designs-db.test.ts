import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Viewer } from "@/server/auth/guard";
import type { JointDesign } from "@/features/analysis/core/design";
import {
  createDesignFromApi,
  createDesignFromForm,
  deleteDesignForViewer,
  duplicateDesignForViewer,
  saveWorkingRevisionForViewer,
  setDesignArchivedForViewer,
  setUnitSystemForViewer,
} from "@/features/designs/commands";
import { TEMPLATE_CHOICES } from "@/features/designs/model/template-fields";
import { findDesign, listDesigns } from "@/features/designs/queries";
import { listActivity } from "@/features/activity/queries";
import { listDesignsQuerySchema } from "@/features/designs/schema";
import { createOrganizationWithMembers, type OrganizationFixture } from "../../setup/fixtures";
import { getTestDb, deleteWithFrozenGuardOff } from "../../setup/test-db";

// Queries and commands on the real PostgreSQL, in organisations of our own.
const db = getTestDb();
let home: OrganizationFixture<"dana" | "piet" | "arlo" | "ines">;
let foreign: OrganizationFixture<"other">;

function viewerOf(fixture: OrganizationFixture<string>, key: string): Viewer {
  const u = fixture.users[key];
  return {
    userId: u.userId,
    email: u.email,
    displayName: u.displayName,
    unitSystem: "SI",
    organizationId: fixture.organizationId,
    organizationName: fixture.organizationName,
    organizationSlug: fixture.slug,
    roles: u.roles,
  };
}

function formDefaults(kind: string, name: string): Record<string, string> {
  const choice = TEMPLATE_CHOICES.find((c) => c.kind === kind)!;
  return {
    name,
    equipmentTag: "E-2107",
    kind,
    ...Object.fromEntries(choice.fields.map((f) => [f.name, f.defaultValue])),
  };
}

async function createCover(name: string, who = "dana"): Promise<string> {
  const result = await createDesignFromForm(db, viewerOf(home, who), formDefaults("rectangular-cover", name));
  if (!result.ok) throw new Error(result.message);
  return result.data.designId;
}

/** Dana saves a document over the working revision she read at `baseVersion`. */
function danaSaves(designId: string, document: JointDesign, baseVersion = 1) {
  return saveWorkingRevisionForViewer(db, viewerOf(home, "dana"), { designId, baseVersion, document });
}

beforeAll(async () => {
  home = await createOrganizationWithMembers(db, {
    dana: ["designer"],
    piet: ["designer", "approver"],
    arlo: ["approver"],
    ines: ["admin"],
  });
  foreign = await createOrganizationWithMembers(db, { other: ["designer", "admin"] });
});
/** Approved revisions refuse DELETE; the guard is off only inside this one cleanup transaction. */
async function dropDesigns(organizationIds: string[]): Promise<void> {
  await deleteWithFrozenGuardOff(async (trx) => {
    await trx.deleteFrom("designs").where("organization_id", "in", organizationIds).execute();
  });
}

afterAll(async () => {
  await dropDesigns([home.organizationId, foreign.organizationId]);
  await home.cleanup();
  await foreign.cleanup();
});

describe("creating designs", () => {
  for (const choice of TEMPLATE_CHOICES) {
    it(`from the ${choice.label} template: revision 1, draft, version 1, result and core version stored`, async () => {
      const result = await createDesignFromForm(
        db,
        viewerOf(home, "dana"),
        formDefaults(choice.kind, `T ${choice.kind}`),
      );
      expect(result.ok).toBe(true);
      const design = await findDesign(db, home.organizationId, result.ok ? result.data.designId : "");
      expect(design).toMatchObject({
        revisionNumber: 1,
        status: "draft",
        version: 1,
        name: `T ${choice.kind}`,
        equipmentTag: "E-2107",
        ownerId: home.users.dana.userId,
      });
      expect(design!.result?.summary.minGasketStressMpa).toBeGreaterThan(0);
      expect(design!.coreVersion).toMatch(/^\d+\.\d+\.\d+$/);
      expect(design!.outlineKind).toBe(design!.document.outline.kind);
    });
  }

  it("an approver cannot create, and bad input saves nothing", async () => {
    const before = (await listDesigns(db, home.organizationId, listDesignsQuerySchema.parse({}))).total;
    const asApprover = await createDesignFromForm(
      db,
      viewerOf(home, "arlo"),
      formDefaults("rectangular-cover", "Nope"),
    );
    expect(asApprover).toMatchObject({ ok: false, reason: "forbidden" });
    const bad = await createDesignFromForm(db, viewerOf(home, "dana"), {
      ...formDefaults("rectangular-cover", ""),
      widthMm: "-1",
    });
    expect(bad).toMatchObject({
      ok: false,
      reason: "invalid",
      fieldErrors: { name: [expect.any(String)], widthMm: [expect.any(String)] },
    });
    const badDoc = await createDesignFromApi(db, viewerOf(home, "dana"), {
      name: "Doc",
      document: { schemaVersion: 1 },
    });
    expect(badDoc.ok).toBe(false);
    expect((await listDesigns(db, home.organizationId, listDesignsQuerySchema.parse({}))).total).toBe(before);
  });
});

describe("organisation isolation", () => {
  it("another organisation's design is not found, listed, saved, duplicated, archived or deleted", async () => {
    const id = await createCover("Isolated cover");
    const other = viewerOf(foreign, "other");
    expect(await findDesign(db, foreign.organizationId, id)).toBeNull();
    expect(
      (await listDesigns(db, foreign.organizationId, listDesignsQuerySchema.parse({}))).items.map(
        (d) => d.designId,
      ),
    ).not.toContain(id);
    const mine = (await findDesign(db, home.organizationId, id))!;
    expect(
      await saveWorkingRevisionForViewer(db, other, {
        designId: id,
        baseVersion: 1,
        document: mine.document,
      }),
    ).toMatchObject({ ok: false, reason: "not-found" });
    expect(await duplicateDesignForViewer(db, other, id)).toMatchObject({ ok: false, reason: "not-found" });
    expect(await setDesignArchivedForViewer(db, other, id, true)).toMatchObject({
      ok: false,
      reason: "not-found",
    });
    expect(await deleteDesignForViewer(db, other, id)).toMatchObject({ ok: false, reason: "not-found" });
    expect((await findDesign(db, home.organizationId, id))!).toMatchObject({ version: 1, archived: false });
  });
});

describe("saving the working revision", () => {
  it("a save based on the current version bumps it and stores the new result", async () => {
    const id = await createCover("Save cover");
    const design = (await findDesign(db, home.organizationId, id))!;
    const moved = {
      ...design.document,
      bolts: design.document.bolts.map((b, i) => (i === 0 ? { ...b, sMm: b.sMm + 5 } : b)),
    };
    const saved = await saveWorkingRevisionForViewer(db, viewerOf(home, "dana"), {
      designId: id,
      baseVersion: 1,
      document: moved,
      name: "Save cover, moved",
      equipmentTag: "E-2108",
    });
    expect(saved).toMatchObject({ ok: true, data: { version: 2 } });
    const after = (await findDesign(db, home.organizationId, id))!;
    expect(after).toMatchObject({ version: 2, name: "Save cover, moved", equipmentTag: "E-2108" });
    expect(after.document.bolts[0].sMm).toBeCloseTo(design.document.bolts[0].sMm + 5, 9);
    expect(after.result).toEqual(saved.ok ? saved.data.result : null);
  });

  it("the activity log gets one 'created' entry and one 'saved' entry per burst of saves by one person", async () => {
    const id = await createCover("Logged cover");
    const kinds = async () =>
      (await listActivity(db, home.organizationId, id))
        .map((e) => `${e.kind}:${e.actorName}:${e.detail}`)
        .reverse();
    expect(await kinds()).toEqual([`created:${home.users.dana.displayName}:Logged cover`]);
    let version = 1;
    const base = (await findDesign(db, home.organizationId, id))!.document;
    // Three autosaves in a row by Dana: one entry, naming the version of the first.
    for (const p of [1.1, 1.2, 1.3]) {
      const r = await danaSaves(id, { ...base, loads: { ...base.loads, designPressureMpa: p } }, version);
      if (!r.ok) throw new Error(r.message);
      version = r.data.version;
    }
    expect(await kinds()).toEqual([
      `created:${home.users.dana.displayName}:Logged cover`,
      `saved:${home.users.dana.displayName}:version 2`,
    ]);
    // Someone else's save is its own entry; a refused (stale) save writes none.
    const piet = await saveWorkingRevisionForViewer(db, viewerOf(home, "piet"), {
      designId: id,
      baseVersion: version,
      document: base,
    });
    expect(piet.ok).toBe(true);
    expect((await danaSaves(id, base, version)).ok).toBe(false);
    expect(await kinds()).toEqual([
      `created:${home.users.dana.displayName}:Logged cover`,
      `saved:${home.users.dana.displayName}:version 2`,
      `saved:${home.users.piet.displayName}:version 5`,
    ]);
  });

  it("a stale save is refused with the conflict message naming who saved last, and the stored document is unchanged", async () => {
    const id = await createCover("Stale cover");
    const base = (await findDesign(db, home.organizationId, id))!;
    const first = { ...base.document, loads: { ...base.document.loads, designPressureMpa: 1.5 } };
    expect(
      (
        await saveWorkingRevisionForViewer(db, viewerOf(home, "piet"), {
          designId: id,
          baseVersion: 1,
          document: first,
        })
      ).ok,
    ).toBe(true);
    const second = { ...base.document, loads: { ...base.document.loads, designPressureMpa: 0.2 } };
    const refused = await danaSaves(id, second);
    expect(refused).toMatchObject({ ok: false, conflict: true, reason: "conflict" });
    expect(!refused.ok && refused.message).toMatch(
      new RegExp(
        `^This design was changed by ${home.users.piet.displayName} at \\d{4}-\\d{2}-\\d{2} \\d{2}:\\d{2} UTC \\(version 2\\)\\. Your edits are kept here; reload to see theirs, or copy your changes\\.$`,
      ),
    );
    const stored = (await findDesign(db, home.organizationId, id))!;
    expect(stored.version).toBe(2);
    expect(stored.document.loads.designPressureMpa).toBe(1.5);
    expect(stored.lastEditedByName).toBe(home.users.piet.displayName);
  });

  it("a revision in review or approved cannot be edited, and nothing changes", async () => {
    const id = await createCover("Frozen cover");
    const base = (await findDesign(db, home.organizationId, id))!;
    await db
      .updateTable("design_revisions")
      .set({ status: "in_review", submitted_by: home.users.dana.userId, submitted_at: new Date() })
      .where("id", "=", base.revisionId)
      .execute();
    const changed = { ...base.document, loads: { ...base.document.loads, designPressureMpa: 3 } };
    const inReview = await danaSaves(id, changed);
    expect(inReview).toMatchObject({
      ok: false,
      reason: "frozen",
      message: "This revision is in review and cannot be edited.",
    });
    await db
      .updateTable("design_revisions")
      .set({ status: "approved", decided_by: home.users.arlo.userId, decided_at: new Date() })
      .where("id", "=", base.revisionId)
      .execute();
    const approved = await danaSaves(id, changed);
    expect(approved).toMatchObject({ ok: false, message: "This revision is approved and cannot be edited." });
    const stored = (await findDesign(db, home.organizationId, id))!;
    expect(stored).toMatchObject({ version: 1, status: "approved" });
    expect(stored.document.loads.designPressureMpa).toBe(base.document.loads.designPressureMpa);
    expect(await deleteDesignForViewer(db, viewerOf(home, "dana"), id)).toMatchObject({
      ok: false,
      reason: "conflict",
    });
  });

  it("a save with a bolt outside the flange or a negative length is refused with field paths and nothing saved", async () => {
    const id = await createCover("Bad save cover");
    const base = (await findDesign(db, home.organizationId, id))!;
    const outside = {
      ...base.document,
      bolts: base.document.bolts.map((b, i) => (i === 2 ? { ...b, offPathMm: 400 } : b)),
    };
    const r1 = await danaSaves(id, outside);
    expect(r1).toMatchObject({
      ok: false,
      reason: "invalid",
      fieldErrors: { "document.bolts[2].position": [expect.stringMatching(/outside the flange outline/)] },
    });
    const negative = { ...base.document, fastener: { ...base.document.fastener, lengthMm: -5 } };
    const r2 = await danaSaves(id, negative);
    expect(r2.ok === false && Object.keys(r2.fieldErrors ?? {})).toContain("document.fastener.lengthMm");
    expect((await findDesign(db, home.organizationId, id))!.version).toBe(1);
  });

  it("an approver cannot save", async () => {
    const id = await createCover("Approver cover");
    const base = (await findDesign(db, home.organizationId, id))!;
    expect(
      await saveWorkingRevisionForViewer(db, viewerOf(home, "arlo"), {
        designId: id,
        baseVersion: 1,
        document: base.document,
      }),
    ).toMatchObject({ ok: false, reason: "forbidden" });
  });
});

describe("duplicate, archive, delete, unit system", () => {
  it("duplicate copies the working document into a new draft owned by the viewer", async () => {
    const id = await createCover("Original cover");
    const copy = await duplicateDesignForViewer(db, viewerOf(home, "piet"), id);
    const dup = (await findDesign(db, home.organizationId, copy.ok ? copy.data.designId : ""))!;
    const original = (await findDesign(db, home.organizationId, id))!;
    expect(dup).toMatchObject({
      name: "Original cover (copy)",
      revisionNumber: 1,
      status: "draft",
      version: 1,
      ownerId: home.users.piet.userId,
    });
    expect(dup.document.bolts).toEqual(original.document.bolts);
  });

  it("archive hides from the register (owner or admin only) and restore brings it back", async () => {
    const id = await createCover("Archive cover");
    const query = listDesignsQuerySchema.parse({ q: "Archive cover" });
    expect(await setDesignArchivedForViewer(db, viewerOf(home, "piet"), id, true)).toMatchObject({
      ok: false,
      reason: "forbidden",
    });
    expect((await setDesignArchivedForViewer(db, viewerOf(home, "dana"), id, true)).ok).toBe(true);
    expect((await listDesigns(db, home.organizationId, query)).total).toBe(0);
    expect((await listDesigns(db, home.organizationId, { ...query, archived: "only" })).total).toBe(1);
    expect((await setDesignArchivedForViewer(db, viewerOf(home, "ines"), id, false)).ok).toBe(true);
    expect((await listDesigns(db, home.organizationId, query)).total).toBe(1);
  });

  it("delete removes a never-submitted draft of the owner and refuses other people", async () => {
    const id = await createCover("Delete cover");
    expect(await deleteDesignForViewer(db, viewerOf(home, "piet"), id)).toMatchObject({
      ok: false,
      reason: "forbidden",
    });
    expect((await deleteDesignForViewer(db, viewerOf(home, "dana"), id)).ok).toBe(true);
    expect(await findDesign(db, home.organizationId, id)).toBeNull();
  });

  it("the unit system is stored per user and a bad value is refused", async () => {
    expect((await setUnitSystemForViewer(db, viewerOf(home, "dana"), "US")).ok).toBe(true);
    expect(
      (
        await db
          .selectFrom("users")
          .select("unit_system")
          .where("id", "=", home.users.dana.userId)
          .executeTakeFirstOrThrow()
      ).unit_system,
    ).toBe("US");
    expect(await setUnitSystemForViewer(db, viewerOf(home, "dana"), "imperial")).toMatchObject({
      ok: false,
      reason: "invalid",
    });
    await setUnitSystemForViewer(db, viewerOf(home, "dana"), "SI");
  });
});

describe("the register query", () => {
  it("searches name and tag, filters by status, owner and outline, sorts and pages", async () => {
    const org = await createOrganizationWithMembers(db, { a: ["designer"], b: ["designer"] });
    try {
      const va = viewerOf(org, "a");
      const vb = viewerOf(org, "b");
      const make = async (v: Viewer, kind: string, name: string, tag: string) => {
        const r = await createDesignFromForm(db, v, { ...formDefaults(kind, name), equipmentTag: tag });
        if (!r.ok) throw new Error(r.message);
        return r.data.designId;
      };
      await make(va, "rectangular-cover", "Bravo hatch", "E-2107");
      const charlie = await make(vb, "circular-flange", "Charlie nozzle", "V-3304");
      await make(va, "obround-manway", "Alpha manway 100%", "V-3304");
      await db
        .updateTable("design_revisions")
        .set({ status: "in_review", submitted_by: org.users.b.userId, submitted_at: new Date() })
        .where("design_id", "=", charlie)
        .execute();
      await db
        .updateTable("design_revisions")
        .set({ status: "returned", decided_by: org.users.a.userId, decided_at: new Date() })
        .where("design_id", "=", charlie)
        .execute();
      const q = (params: Record<string, string>) =>
        listDesigns(db, org.organizationId, listDesignsQuerySchema.parse(params));
      expect((await q({})).items.map((d) => d.name)).toEqual([
        "Alpha manway 100%",
        "Charlie nozzle",
        "Bravo hatch",
      ]);
      expect((await q({ sort: "name" })).items.map((d) => d.name)).toEqual([
        "Alpha manway 100%",
        "Bravo hatch",
        "Charlie nozzle",
      ]);
      expect((await q({ sort: "name", dir: "desc" })).items[0].name).toBe("Charlie nozzle");
      expect((await q({ sort: "status", dir: "desc" })).items[0].name).toBe("Charlie nozzle");
      expect((await q({ q: "v-3304" })).items.map((d) => d.name).sort()).toEqual([
        "Alpha manway 100%",
        "Charlie nozzle",
      ]);
      expect((await q({ q: "100%" })).items.map((d) => d.name)).toEqual(["Alpha manway 100%"]);
      expect((await q({ q: "%" })).total).toBe(1);
      expect((await q({ status: "returned" })).items.map((d) => d.name)).toEqual(["Charlie nozzle"]);
      expect((await q({ owner: org.users.a.userId })).total).toBe(2);
      expect((await q({ outline: "obround" })).items.map((d) => d.name)).toEqual(["Alpha manway 100%"]);
      expect((await q({ updatedWithinDays: "1" })).total).toBe(3);
      await db
        .updateTable("designs")
        .set({ updated_at: sql`now() - interval '10 days'` })
        .where("id", "=", charlie)
        .execute();
      expect((await q({ updatedWithinDays: "7" })).total).toBe(2);
      expect((await q({ status: "bogus", page: "-3", sort: "nope" })).total).toBe(3);
      const paged = await q({ page: "99" });
      expect(paged).toMatchObject({ page: 1, pageCount: 1, total: 3 });
    } finally {
      await dropDesigns([org.organizationId]);
      await org.cleanup();
    }
  });
});
