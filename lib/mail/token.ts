import { createHash, randomBytes } from "node:crypto";

// Set-password links carry 32 random bytes; the database keeps only their SHA-256. A fast hash is
// enough here (unlike passwords): the token has 256 bits of entropy, so there is nothing to guess.
export function newLinkToken(): string {
  return randomBytes(32).toString("base64url");
}

export function tokenSha256(token: string): string {
  return createHash("sha256").update(token, "utf8").digest("hex");
}

export const INVITE_LIFETIME_MS = 72 * 60 * 60 * 1000;
export const RESET_LIFETIME_MS = 60 * 60 * 1000;

/** Well-formed tokens only reach the database: 43 base64url characters. */
export function looksLikeToken(token: string): boolean {
  return /^[A-Za-z0-9_-]{43}$/.test(token);
}
