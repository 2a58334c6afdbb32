import "server-only";
import type { Executor } from "@/db/types";
import type { AttachmentDto, AttachmentListDto } from "./model/dto";
import { isoString } from "@/db/dates";

// Reads of design attachments, always within one organisation: an id of another organisation's
// attachment or design finds nothing (the route answers 404).

function baseQuery(db: Executor, organizationId: string) {
  return db
    .selectFrom("design_attachments as a")
    .innerJoin("users as u", "u.id", "a.uploaded_by")
    .select([
      "a.id",
      "a.design_id",
      "a.blob_id",
      "a.file_name",
      "a.kind",
      "a.content_type",
      "a.size_bytes",
      "a.sha256",
      "a.uploaded_by",
      "a.created_at",
      "u.display_name",
    ])
    .where("a.organization_id", "=", organizationId);
}

type Row = Awaited<ReturnType<ReturnType<typeof baseQuery>["executeTakeFirstOrThrow"]>>;

function toDto(r: Row): AttachmentDto {
  return {
    id: r.id,
    designId: r.design_id,
    fileName: r.file_name,
    kind: r.kind,
    contentType: r.content_type,
    sizeBytes: r.size_bytes,
    sha256: r.sha256,
    uploadedById: r.uploaded_by,
    uploadedByName: r.display_name,
    createdAt: isoString(r.created_at),
  };
}

/** The design's working revision status, or null when the design is not in this organisation. */
export async function findDesignState(
  db: Executor,
  organizationId: string,
  designId: string,
): Promise<{ workingStatus: string | null } | null> {
  const design = await db
    .selectFrom("designs")
    .select("id")
    .where("organization_id", "=", organizationId)
    .where("id", "=", designId)
    .executeTakeFirst();
  if (!design) return null;
  const working = await db
    .selectFrom("design_revisions")
    .select("status")
    .where("design_id", "=", designId)
    .where("organization_id", "=", organizationId)
    .orderBy("number", "desc")
    .limit(1)
    .executeTakeFirst();
  return { workingStatus: working?.status ?? null };
}

export async function listAttachments(
  db: Executor,
  organizationId: string,
  designId: string,
): Promise<AttachmentListDto | null> {
  const state = await findDesignState(db, organizationId, designId);
  if (!state) return null;
  const rows = await baseQuery(db, organizationId)
    .where("a.design_id", "=", designId)
    .orderBy("a.created_at", "desc")
    .orderBy("a.id")
    .execute();
  return { attachments: rows.map(toDto), locked: state.workingStatus === "approved" };
}

export async function findAttachment(
  db: Executor,
  organizationId: string,
  designId: string,
  attachmentId: string,
): Promise<(AttachmentDto & { blobId: string }) | null> {
  const row = await baseQuery(db, organizationId)
    .where("a.design_id", "=", designId)
    .where("a.id", "=", attachmentId)
    .executeTakeFirst();
  return row ? { ...toDto(row), blobId: row.blob_id } : null;
}
