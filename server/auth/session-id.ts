import "server-only";
import { createHash } from "node:crypto";

// The sessions table stores SHA-256 of each session id, never the id itself (as lucia v3's own
// guides describe): someone who can read the table, a backup or a log of its rows holds no live
// session. The cookie carries the id; every lookup hashes it first.
export function hashSessionId(sessionId: string): string {
  return createHash("sha256").update(sessionId, "utf8").digest("hex");
}
