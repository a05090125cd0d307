import { createHash, randomBytes, randomUUID } from "node:crypto";
import { addDays } from "date-fns";
import type { Role } from "../../shared/access/roles";
import type { Database } from "../../server/db/client";
import { emailVerifications, invitations, passwordResets } from "../../server/db/schema/accounts";

/** An address nobody else in the run uses, so tests never read each other's mail or rows. */
export function uniqueEmail(label = "person"): string {
  return `${label}-${randomUUID().slice(0, 8)}@example.com`;
}

export const sha256Hex = (text: string) => createHash("sha256").update(text).digest("hex");

/**
 * An open invitation made straight in the database, with the link token the mail would carry.
 * Only the token's SHA-256 is stored, as the server does.
 */
export async function createInvitation(
  db: Database,
  input: { channelId: string; invitedBy: { id: string }; email?: string; role?: Role; expiresAt?: Date },
) {
  const token = randomBytes(32).toString("base64url");
  const [row] = await db
    .insert(invitations)
    .values({
      channelId: input.channelId,
      email: input.email ?? uniqueEmail("invitee"),
      role: input.role ?? "crew",
      tokenHash: sha256Hex(token),
      invitedBy: input.invitedBy.id,
      expiresAt: input.expiresAt ?? addDays(new Date(), 7),
    })
    .returning();
  if (!row) throw new Error("invitation insert returned nothing");
  return { ...row, token };
}

/** An open address-confirmation link for this account, made straight in the database; answers its token. */
export async function createVerification(db: Database, user: { id: string; email: string }, expiresAt = addDays(new Date(), 1)): Promise<string> {
  const token = randomBytes(32).toString("base64url");
  await db.insert(emailVerifications).values({ userId: user.id, email: user.email, tokenHash: sha256Hex(token), expiresAt });
  return token;
}

/** An open "set a new password" link for this account, made straight in the database; answers its token. */
export async function createPasswordReset(db: Database, user: { id: string }, expiresAt = new Date(Date.now() + 3_600_000)): Promise<string> {
  const token = randomBytes(32).toString("base64url");
  await db.insert(passwordResets).values({ userId: user.id, tokenHash: sha256Hex(token), expiresAt });
  return token;
}
