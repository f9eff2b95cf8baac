import "server-only";
import { createHash, randomBytes } from "node:crypto";

/**
 * One-time tokens for mailed links (invitations, password resets). The token itself travels only
 * in the mail; the database keeps its SHA-256, so a copy of the database (a backup, a leak) holds
 * no link that works. 32 random bytes cannot be guessed, so a plain hash (no salt, no cost) is
 * enough and lets the token be looked up by its hash.
 */
export function newToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: hashToken(token) };
}

export function hashToken(token: string): string {
  return createHash("sha256").update(token).digest("hex");
}
