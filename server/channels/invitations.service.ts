import { createHash, randomBytes } from "node:crypto";
import { addDays } from "date-fns";
import type { Role } from "../../shared/access/roles";
import { roleLabels } from "../../shared/access/roles";
import type { AcceptInvitationInput, InvitationPreview } from "../../shared/channels/schemas";
import type { Database } from "../db/client";
import { hashPassword } from "../auth/password";
import { findUserWithHashByEmail, insertUser } from "../auth/users.repository";
import { AppError } from "../http/app-error";
import type { OutgoingMail } from "../mail/mailer";
import { claimInvitation, findInvitationByHash, insertInvitation } from "./channels.repository";

export const INVITATION_LIFETIME_DAYS = 7;

const hashToken = (token: string) => createHash("sha256").update(token).digest("hex");

export interface InvitationDeps {
  db: Database;
  appUrl: string;
  enqueueMail(mail: OutgoingMail): Promise<void>;
}

export async function inviteMember(deps: InvitationDeps, input: { channelId: string; email: string; role: Role; invitedBy: Express.User; channelName: string }) {
  const token = randomBytes(32).toString("base64url");
  const expiresAt = addDays(new Date(), INVITATION_LIFETIME_DAYS);
  const { id } = await insertInvitation(deps.db, {
    channelId: input.channelId,
    email: input.email,
    role: input.role,
    tokenHash: hashToken(token),
    invitedBy: input.invitedBy.id,
    expiresAt,
  });
  const link = `${deps.appUrl}/invite/${token}`;
  await deps.enqueueMail({
    to: input.email,
    subject: `${input.invitedBy.name} invited you to ${input.channelName} on Kerf`,
    text: [
      `${input.invitedBy.name} invited you to join ${input.channelName} on Kerf as ${roleLabels[input.role].toLowerCase()}.`,
      "",
      `Open this link to accept (it works once and expires in ${INVITATION_LIFETIME_DAYS} days):`,
      link,
      "",
      "If you weren't expecting this, ignore the message; nothing happens until the link is opened.",
    ].join("\n"),
  });
  return { id, expiresAt };
}

async function openInvitation(db: Database, token: string) {
  const invitation = await findInvitationByHash(db, hashToken(token));
  if (!invitation) throw new AppError("not_found", "This invitation link is not valid. Ask for a new one.");
  return invitation;
}

function stateOf(invitation: { acceptedAt: Date | null; revokedAt: Date | null; expiresAt: Date }): InvitationPreview["state"] {
  if (invitation.acceptedAt) return "accepted";
  if (invitation.revokedAt) return "revoked";
  if (invitation.expiresAt.getTime() <= Date.now()) return "expired";
  return "open";
}

export async function previewInvitation(db: Database, token: string): Promise<InvitationPreview> {
  const invitation = await openInvitation(db, token);
  const existing = await findUserWithHashByEmail(db, invitation.email);
  return {
    channelName: invitation.channelName,
    email: invitation.email,
    role: invitation.role,
    invitedBy: invitation.invitedBy,
    state: stateOf(invitation),
    hasAccount: existing !== null,
  };
}

const closedMessages = {
  accepted: "This invitation has already been used. Sign in, or ask for a new invitation.",
  expired: "This invitation has expired. Ask the channel's owner for a new one.",
  revoked: "This invitation was withdrawn. Ask the channel's owner for a new one.",
};

/**
 * A signed-in person joins with their own account; a newcomer names themselves and sets a password,
 * and the account is made for the invited address.
 */
export async function acceptInvitation(db: Database, token: string, input: AcceptInvitationInput, signedIn: Express.User | undefined) {
  const invitation = await openInvitation(db, token);
  const state = stateOf(invitation);
  if (state !== "open") throw new AppError("gone", closedMessages[state]);

  const user = signedIn ?? (await createInvitedAccount(db, invitation.email, input));
  const outcome = await claimInvitation(db, invitation, user.id);
  if (outcome === "used") throw new AppError("gone", closedMessages.accepted);
  if (outcome === "already_member") throw new AppError("conflict", "You are already a member of this channel; the invitation is still open for its addressee.");
  return { user, channelId: invitation.channelId, newAccount: !signedIn };
}

async function createInvitedAccount(db: Database, email: string, input: AcceptInvitationInput) {
  if (!("password" in input)) {
    throw new AppError("validation_failed", "Choose your name and a password to create your account.", {
      name: "Enter your name.",
      password: "Choose a password.",
    });
  }
  const user = await insertUser(db, { email, name: input.name, passwordHash: await hashPassword(input.password) });
  if (!user) throw new AppError("conflict", "An account with this e-mail already exists: sign in first, then open the link again.");
  return user;
}
