import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { MAX_ATTACHMENT_BYTES } from "@/features/attachments/model/dto";
import { sniffContent } from "@/features/attachments/model/sniff-content";
import { deleteAttachment, uploadAttachment, type Actor } from "@/features/attachments/mutations";
import { findAttachment, listAttachments } from "@/features/attachments/queries";
import { getBlob } from "@/server/storage/blob-store";
import { getTestDb } from "../../setup/test-db";
import { createOrgWithUsers, dropOrg } from "../library/helpers";

const db = getTestDb();
const PDF = new TextEncoder().encode("%PDF-1.7\n1 0 obj <<>> endobj\ntrailer <<>>\n%%EOF\n");
const PNG = new Uint8Array([
  0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52,
]);
const EXE = new Uint8Array([0x4d, 0x5a, 0x90, 0x00, 0x03, 0x00, 0x00, 0x00]); // "MZ" header of a Windows program

let a: Awaited<ReturnType<typeof createOrgWithUsers>>;
let b: Awaited<ReturnType<typeof createOrgWithUsers>>;
let designId: string;
let designer: Actor;
let admin: Actor;

async function makeDesign(orgId: string, ownerId: string): Promise<string> {
  const d = await db
    .insertInto("designs")
    .values({ organization_id: orgId, name: "E-2107 channel", outline_kind: "circle", owner_id: ownerId })
    .returning("id")
    .executeTakeFirstOrThrow();
  await db
    .insertInto("design_revisions")
    .values({
      design_id: d.id,
      organization_id: orgId,
      number: 1,
      document: JSON.stringify({}),
      created_by: ownerId,
      last_edited_by: ownerId,
    })
    .execute();
  return d.id;
}

describe("design attachments (real PostgreSQL)", () => {
  beforeAll(async () => {
    a = await createOrgWithUsers("attach-a");
    b = await createOrgWithUsers("attach-b");
    designId = await makeDesign(a.organizationId, a.designerId);
    designer = { userId: a.designerId, organizationId: a.organizationId, roles: ["designer"] };
    admin = { userId: a.adminId, organizationId: a.organizationId, roles: ["admin", "designer"] };
  });
  afterAll(async () => {
    await dropOrg(a.organizationId);
    await dropOrg(b.organizationId);
  });

  it("detects content by magic bytes, never by name", () => {
    expect(sniffContent(PDF)).toBe("pdf");
    expect(sniffContent(PNG)).toBe("png");
    expect(sniffContent(new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 0x10]))).toBe("jpeg");
    expect(sniffContent(new TextEncoder().encode("  0\r\nSECTION\r\n  2\r\nHEADER\r\n"))).toBe("dxf");
    expect(sniffContent(new TextEncoder().encode("0\nSECTION\n2\nENTITIES\n"))).toBe("dxf");
    expect(sniffContent(new TextEncoder().encode("0\nSECTIONS are fun"))).toBeNull();
    expect(sniffContent(EXE)).toBeNull();
  });

  it("stores a PDF and gives back the same bytes; a PNG named .pdf is stored as the PNG it is", async () => {
    const up = await uploadAttachment(db, designer, designId, "gasket-datasheet.pdf", PDF);
    if (!up.ok) throw new Error(up.message);
    expect(up.data).toMatchObject({
      fileName: "gasket-datasheet.pdf",
      kind: "pdf",
      contentType: "application/pdf",
      sizeBytes: PDF.byteLength,
      uploadedById: a.designerId,
    });
    const found = await findAttachment(db, a.organizationId, designId, up.data.id);
    const bytes = await getBlob(db, a.organizationId, found!.blobId);
    expect(Buffer.compare(bytes!, Buffer.from(PDF))).toBe(0);

    const png = await uploadAttachment(db, designer, designId, "photo.pdf", PNG);
    expect(png).toMatchObject({
      ok: true,
      data: { kind: "png", contentType: "image/png", fileName: "photo.pdf.png" },
    });
    const list = await listAttachments(db, a.organizationId, designId);
    expect(list?.attachments.map((x) => x.kind).sort()).toEqual(["pdf", "png"]);
    expect(list?.attachments[0].uploadedByName).toMatch(/^designer /);
  });

  it("refuses an empty file, a file over 20 MB and a program renamed .pdf, with clear messages, storing nothing", async () => {
    const blobsBefore = await db
      .selectFrom("blobs")
      .select(db.fn.countAll<number>().as("n"))
      .where("organization_id", "=", a.organizationId)
      .executeTakeFirstOrThrow();
    expect(await uploadAttachment(db, designer, designId, "empty.pdf", new Uint8Array(0))).toEqual({
      ok: false,
      status: 400,
      message: "The file is empty: nothing was attached.",
    });
    const big = new Uint8Array(MAX_ATTACHMENT_BYTES + 1);
    big.set(PDF);
    expect(await uploadAttachment(db, designer, designId, "huge.pdf", big)).toEqual({
      ok: false,
      status: 413,
      message: "The file is larger than 20 MB (20.00 MB): attachments may be at most 20 MB.",
    });
    const exe = await uploadAttachment(db, designer, designId, "datasheet.pdf", EXE);
    expect(exe).toMatchObject({
      ok: false,
      status: 415,
      message: expect.stringMatching(/Only PDF, PNG, JPEG or DXF files can be attached/),
    });
    const blobsAfter = await db
      .selectFrom("blobs")
      .select(db.fn.countAll<number>().as("n"))
      .where("organization_id", "=", a.organizationId)
      .executeTakeFirstOrThrow();
    expect(Number(blobsAfter.n)).toBe(Number(blobsBefore.n));
  });

  it("another organisation cannot list, download or delete an attachment even with its ids", async () => {
    const up = await uploadAttachment(db, designer, designId, "flange-drawing.pdf", PDF);
    if (!up.ok) throw new Error(up.message);
    const intruder: Actor = {
      userId: b.adminId,
      organizationId: b.organizationId,
      roles: ["admin", "designer"],
    };
    expect(await findAttachment(db, b.organizationId, designId, up.data.id)).toBeNull();
    expect(await listAttachments(db, b.organizationId, designId)).toBeNull();
    const found = await findAttachment(db, a.organizationId, designId, up.data.id);
    expect(await getBlob(db, b.organizationId, found!.blobId)).toBeNull();
    expect(await deleteAttachment(db, intruder, designId, up.data.id)).toMatchObject({
      ok: false,
      status: 404,
    });
    expect(await uploadAttachment(db, intruder, designId, "x.pdf", PDF)).toMatchObject({
      ok: false,
      status: 404,
    });
  });

  it("only the uploader or an admin deletes, and nobody once the working revision is approved", async () => {
    const up = await uploadAttachment(db, admin, designId, "admin-note.pdf", PDF);
    if (!up.ok) throw new Error(up.message);
    expect(await deleteAttachment(db, designer, designId, up.data.id)).toMatchObject({
      ok: false,
      status: 403,
    });
    const mine = await uploadAttachment(db, designer, designId, "mine.pdf", PDF);
    if (!mine.ok) throw new Error(mine.message);
    expect(await deleteAttachment(db, designer, designId, mine.data.id)).toEqual({
      ok: true,
      data: { id: mine.data.id },
    });
    expect(await findAttachment(db, a.organizationId, designId, mine.data.id)).toBeNull();

    // Freeze the working revision the way the review trigger allows (status columns only).
    const approver = await db
      .insertInto("users")
      .values({ email: `approver.${a.slug}@test.example`, display_name: "Approver", password_hash: null })
      .returning("id")
      .executeTakeFirstOrThrow();
    await db
      .insertInto("memberships")
      .values({ organization_id: a.organizationId, user_id: approver.id, roles: ["approver"] })
      .execute();
    const approvedDesign = await makeDesign(a.organizationId, a.designerId);
    const held = await uploadAttachment(db, designer, approvedDesign, "held.pdf", PDF);
    if (!held.ok) throw new Error(held.message);
    await db
      .updateTable("design_revisions")
      .set({ status: "in_review", submitted_by: a.designerId, submitted_at: new Date() })
      .where("design_id", "=", approvedDesign)
      .execute();
    await db
      .updateTable("design_revisions")
      .set({ status: "approved", decided_by: approver.id, decided_at: new Date() })
      .where("design_id", "=", approvedDesign)
      .execute();
    expect(await deleteAttachment(db, admin, approvedDesign, held.data.id)).toMatchObject({
      ok: false,
      status: 409,
      message: expect.stringMatching(/approved/),
    });
    expect((await listAttachments(db, a.organizationId, approvedDesign))?.locked).toBe(true);
  });
});
