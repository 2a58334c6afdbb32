import "server-only";
import type { Kysely } from "kysely";
import type { Role } from "@/db/tables/core";
import type { Database } from "@/db/types";
import { deleteBlob, putBlob } from "@/server/storage/blob-store";
import { ACCEPTED_KINDS_TEXT, MAX_ATTACHMENT_BYTES, type AttachmentDto } from "./model/dto";
import { CONTENT_TYPES, sniffContent } from "./model/sniff-content";
import { canDeleteAttachment, canUploadAttachment } from "./policies";
import { findAttachment, findDesignState } from "./queries";
import { cleanFileName } from "./model/file-name";

// Upload and delete. Results carry the HTTP status the route answers with, so the route stays a
// thin adapter and these rules are tested against the real database without a browser.
export interface Actor {
  userId: string;
  organizationId: string;
  roles: readonly Role[];
}

export type AttachmentResult<T> =
  { ok: true; data: T } | { ok: false; status: 400 | 403 | 404 | 409 | 413 | 415; message: string };

const MB = 1024 * 1024;

export function checkUpload(
  fileName: string,
  bytes: Uint8Array,
):
  | { ok: true; kind: keyof typeof CONTENT_TYPES; name: string }
  | { ok: false; status: 400 | 413 | 415; message: string } {
  if (bytes.byteLength === 0)
    return { ok: false, status: 400, message: "The file is empty: nothing was attached." };
  if (bytes.byteLength > MAX_ATTACHMENT_BYTES) {
    return {
      ok: false,
      status: 413,
      message: `The file is larger than ${MAX_ATTACHMENT_BYTES / MB} MB (${(bytes.byteLength / MB).toFixed(2)} MB): attachments may be at most ${MAX_ATTACHMENT_BYTES / MB} MB.`,
    };
  }
  const kind = sniffContent(bytes);
  if (!kind) {
    return {
      ok: false,
      status: 415,
      message: `Only ${ACCEPTED_KINDS_TEXT} files can be attached, and this file's content is none of these (its name and declared type are not trusted).`,
    };
  }
  return { ok: true, kind, name: cleanFileName(fileName, kind) };
}

export async function uploadAttachment(
  db: Kysely<Database>,
  actor: Actor,
  designId: string,
  fileName: string,
  bytes: Uint8Array,
): Promise<AttachmentResult<AttachmentDto>> {
  if (!canUploadAttachment(actor))
    return { ok: false, status: 403, message: "Only designers and admins can attach files." };
  const design = await findDesignState(db, actor.organizationId, designId);
  if (!design) return { ok: false, status: 404, message: "This design does not exist." };
  const checked = checkUpload(fileName, bytes);
  if (!checked.ok) return checked;
  const id = await db.transaction().execute(async (trx) => {
    const blob = await putBlob(trx, actor.organizationId, bytes);
    const row = await trx
      .insertInto("design_attachments")
      .values({
        organization_id: actor.organizationId,
        design_id: designId,
        blob_id: blob.id,
        file_name: checked.name,
        kind: checked.kind,
        content_type: CONTENT_TYPES[checked.kind],
        size_bytes: blob.sizeBytes,
        sha256: blob.sha256,
        uploaded_by: actor.userId,
      })
      .returning("id")
      .executeTakeFirstOrThrow();
    return row.id;
  });
  const dto = await findAttachment(db, actor.organizationId, designId, id);
  if (!dto) throw new Error("attachment vanished right after upload");
  const { blobId: _blobId, ...data } = dto;
  return { ok: true, data };
}

export async function deleteAttachment(
  db: Kysely<Database>,
  actor: Actor,
  designId: string,
  attachmentId: string,
): Promise<AttachmentResult<{ id: string }>> {
  const design = await findDesignState(db, actor.organizationId, designId);
  const attachment = design ? await findAttachment(db, actor.organizationId, designId, attachmentId) : null;
  if (!design || !attachment) return { ok: false, status: 404, message: "This attachment does not exist." };
  if (design.workingStatus === "approved")
    return {
      ok: false,
      status: 409,
      message: "The working revision is approved: its attachments can no longer be removed.",
    };
  if (!canDeleteAttachment(actor, attachment, false))
    return {
      ok: false,
      status: 403,
      message: "Only the person who attached this file or an admin can remove it.",
    };
  await db.transaction().execute(async (trx) => {
    await trx
      .deleteFrom("design_attachments")
      .where("organization_id", "=", actor.organizationId)
      .where("id", "=", attachmentId)
      .execute();
    await deleteBlob(trx, actor.organizationId, attachment.blobId);
  });
  return { ok: true, data: { id: attachmentId } };
}
