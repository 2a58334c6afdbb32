// Attachment DTOs (types only, safe on the client) and the upload limits both sides show.
import type { AttachmentKind } from "@/db/tables/library";

export type { AttachmentKind };
export const MAX_ATTACHMENT_BYTES = 20 * 1024 * 1024;
export const ACCEPTED_KINDS_TEXT = "PDF, PNG, JPEG or DXF";

export interface AttachmentDto {
  id: string;
  designId: string;
  fileName: string;
  kind: AttachmentKind;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  uploadedById: string;
  uploadedByName: string;
  /** ISO 8601. */
  createdAt: string;
}

export interface AttachmentListDto {
  attachments: AttachmentDto[];
  /** The working revision is approved: nothing may be deleted. */
  locked: boolean;
}
