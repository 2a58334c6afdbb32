import "server-only";
import { createHash } from "node:crypto";
import type { Executor } from "@/db/types";

// The blob store: bytes in PostgreSQL (bytea). Everything else talks to these four functions, so
// moving to an S3-compatible store later changes this file only. Every call is scoped to an
// organisation: a blob id of another organisation reads as missing.

export interface StoredBlob {
  id: string;
  sizeBytes: number;
  sha256: string;
}

export function sha256Hex(bytes: Uint8Array): string {
  return createHash("sha256").update(bytes).digest("hex");
}

export async function putBlob(db: Executor, organizationId: string, bytes: Uint8Array): Promise<StoredBlob> {
  const sha256 = sha256Hex(bytes);
  const row = await db
    .insertInto("blobs")
    .values({
      organization_id: organizationId,
      bytes: Buffer.from(bytes),
      size_bytes: bytes.byteLength,
      sha256,
    })
    .returning(["id", "size_bytes", "sha256"])
    .executeTakeFirstOrThrow();
  return { id: row.id, sizeBytes: row.size_bytes, sha256: row.sha256 };
}

export async function getBlob(db: Executor, organizationId: string, blobId: string): Promise<Buffer | null> {
  const row = await db
    .selectFrom("blobs")
    .select("bytes")
    .where("organization_id", "=", organizationId)
    .where("id", "=", blobId)
    .executeTakeFirst();
  return row ? row.bytes : null;
}

export async function deleteBlob(db: Executor, organizationId: string, blobId: string): Promise<boolean> {
  const result = await db
    .deleteFrom("blobs")
    .where("organization_id", "=", organizationId)
    .where("id", "=", blobId)
    .executeTakeFirst();
  return Number(result.numDeletedRows) > 0;
}
