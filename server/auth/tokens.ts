import "server-only";
import { createHash, randomBytes } from "node:crypto";

// Tokens for e-mailed links: 32 random bytes in the link, only the sha-256 digest in the database.
export function createToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, tokenHash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}
