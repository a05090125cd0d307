import { hash, verify } from "@node-rs/argon2";

// argon2id with the library's defaults (19 MiB, 2 passes, 1 lane): the OWASP Password Storage
// Cheat Sheet's minimum recommended configuration for argon2id.
export function hashPassword(password: string): Promise<string> {
  return hash(password);
}

export async function passwordMatches(passwordHash: string, password: string): Promise<boolean> {
  try {
    return await verify(passwordHash, password);
  } catch {
    return false;
  }
}

/** Verified against when no account matches, so a missing e-mail takes as long as a wrong password. */
export const decoyHash = await hash("decoy-password-never-used");
