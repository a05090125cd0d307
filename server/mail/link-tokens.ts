import { createHash, randomBytes } from "node:crypto";

/** The secret part of a mailed link (invitation, address confirmation): 32 random bytes, base64url. */
export function newLinkToken(): { token: string; hash: string } {
  const token = randomBytes(32).toString("base64url");
  return { token, hash: hashLinkToken(token) };
}

/** Only this SHA-256 is stored: a leaked table opens nothing. */
export const hashLinkToken = (token: string) => createHash("sha256").update(token).digest("hex");
