import { addDays } from "date-fns";
import { formatInstantNamingZone } from "../../shared/fields/written-dates";
import { roleLabels, roleMay, type Role } from "../../shared/access/roles";
import type { AcceptInvitationInput, InvitationPreview } from "../../shared/channels/schemas";
import type { Database } from "../db/client";
import { inTransaction } from "../db/transaction";
import { hashPassword } from "../auth/password";
import { findUserWithHashByEmail } from "../auth/users.repository";
import { AppError } from "../http/app-error";
import type { Jobs } from "../jobs/queue";
import { hashLinkToken, newLinkToken } from "../mail/link-tokens";
import { channelShare, mailKind, type MailRenderers } from "../mail/mail-jobs";
import { takeMailQuota } from "../mail/quotas";
import { requireConfirmedAddress } from "../mail/senders";
import {
  claimInvitation,
  findInvitationByHash,
  findInvitationToMail,
  findOpenInvitationTo,
  insertInvitation,
  isMemberByEmail,
  lockChannel,
  setInvitationToken,
  type Joiner,
} from "./channels.repository";

export const INVITATION_LIFETIME_DAYS = 7;

export interface InvitationDeps {
  db: Database;
  appUrl: string;
  jobs: Pick<Jobs, "enqueueMail">;
}

/** An invitation's mail: its link is made when the mail is sent, so the queue never holds a usable one. */
const invitationMail = mailKind<{ invitationId: string }>("invitation");

const mayInvite = (role: Role | null) => role !== null && roleMay(role, "members", "W");

/**
 * Invites one address: refused (409, nothing sent) when it is already a member or already has an open
 * invitation; otherwise counted against the sender's and the channel's allowance, stored and queued in
 * one transaction. The channel's row is locked meanwhile, so two owners inviting the same address at
 * once make one invitation.
 */
export async function inviteMember(deps: InvitationDeps, input: { channelId: string; email: string; role: Role; invitedBy: Express.User }) {
  requireConfirmedAddress(input.invitedBy);
  const expiresAt = addDays(new Date(), INVITATION_LIFETIME_DAYS);
  return inTransaction(deps.db, async (tx, sql) => {
    await lockChannel(tx, input.channelId);
    if (await isMemberByEmail(tx, input.channelId, input.email)) {
      throw new AppError("conflict", `${input.email} is already a member of this channel; nothing was sent.`, { email: "Already a member of this channel." });
    }
    const open = await findOpenInvitationTo(tx, input.channelId, input.email);
    if (open) {
      throw new AppError(
        "conflict",
        `${input.email} already has an open invitation (sent ${open.createdAt.toISOString().slice(0, 10)}, open until ${open.expiresAt.toISOString().slice(0, 10)}); nothing was sent. Withdraw it first to send a new one.`,
        { email: "Already invited; the invitation is still open." },
      );
    }
    await takeMailQuota(tx, "invitation", { userId: input.invitedBy.id, channelId: input.channelId });
    // The stored hash is of a token nobody holds until the mail is sent and gives the link its own.
    const { id } = await insertInvitation(tx, { ...input, invitedBy: input.invitedBy.id, tokenHash: newLinkToken().hash, expiresAt });
    await deps.jobs.enqueueMail(invitationMail.job({ invitationId: id }, channelShare(input.channelId)), { db: sql });
    return { id, expiresAt };
  });
}

/** Builds an invitation's mail when it is sent: only while it is open and its sender may still invite. */
export function invitationMailRenderer(deps: Pick<InvitationDeps, "db" | "appUrl">): MailRenderers {
  return invitationMail.renderer(async ({ invitationId }) => {
    const invitation = await findInvitationToMail(deps.db, invitationId);
    if (!invitation || !invitation.open) return { skip: "the invitation is no longer open" };
    if (!mayInvite(invitation.inviterRole)) return { skip: "its sender no longer manages the channel's members" };
    const { token, hash } = newLinkToken();
    if (!(await setInvitationToken(deps.db, invitationId, hash))) return { skip: "the invitation is no longer open" };
    return {
      send: {
        to: invitation.email,
        subject: `${invitation.invitedBy} invited you to ${invitation.channelName} on Kerf`,
        text: [
          `${invitation.invitedBy} invited you to join ${invitation.channelName} on Kerf as ${roleLabels[invitation.role].toLowerCase()}.`,
          "",
          `Open this link to accept (it works once, for this address, and expires on ${formatInstantNamingZone(invitation.expiresAt, invitation.inviteeTimeZone ?? "UTC")}):`,
          `${deps.appUrl}/invite/${token}`,
          "",
          "If you weren't expecting this, ignore the message; nothing happens until the link is opened.",
        ].join("\n"),
      },
    };
  });
}

async function openInvitation(db: Database, token: string) {
  const invitation = await findInvitationByHash(db, hashLinkToken(token));
  if (!invitation) throw new AppError("not_found", "This invitation link is not valid. Ask for a new one.");
  return invitation;
}

function stateOf(invitation: { acceptedAt: Date | null; revokedAt: Date | null; closedAt: Date | null; expiresAt: Date; inviterRole: Role | null }): InvitationPreview["state"] {
  if (invitation.acceptedAt) return "accepted";
  if (invitation.closedAt) return "closed";
  // An invitation whose sender no longer manages the channel's members is withdrawn with their role.
  if (invitation.revokedAt || !mayInvite(invitation.inviterRole)) return "revoked";
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
  closed: "This invitation is closed: its addressee has already joined the channel. Sign in to open it.",
};

const refusals = {
  account_exists: () => new AppError("conflict", "An account with this e-mail already exists: sign in first, then open the link again."),
  already_member: () => new AppError("conflict", "You are already a member of this channel; the invitation stays open."),
};

/**
 * Only the invited address may accept: a signed-in person whose account has that address joins with
 * it; a newcomer names themselves and sets a password, and the account is made for that address.
 * Every refusal comes before the link is claimed, or undoes the claim, so nothing is burnt.
 */
export async function acceptInvitation(db: Database, token: string, input: AcceptInvitationInput, signedIn: Express.User | undefined) {
  const invitation = await openInvitation(db, token);
  const state = stateOf(invitation);
  if (state !== "open") throw new AppError("gone", closedMessages[state]);
  if (signedIn && signedIn.email !== invitation.email) {
    throw new AppError(
      "forbidden",
      `This invitation is for ${invitation.email}, and you are signed in as ${signedIn.email}. Sign out, then open the link again to join with ${invitation.email}.`,
    );
  }
  const joiner: Joiner = signedIn ? { userId: signedIn.id } : { newAccount: await newAccountFor(invitation.email, input) };
  const claimed = await claimInvitation(db, invitation, joiner);
  if (claimed.outcome === "closed") throw await closedMeanwhile(db, token);
  if (claimed.outcome !== "joined") throw refusals[claimed.outcome]();
  // The session's copy of the account was read before joining confirmed its address.
  if (signedIn) signedIn.emailVerified = true;
  return { user: claimed.user, channelId: invitation.channelId, newAccount: !signedIn };
}

/** The link closed between reading it and claiming it (used by someone else, or withdrawn): says which. */
async function closedMeanwhile(db: Database, token: string): Promise<AppError> {
  const state = stateOf(await openInvitation(db, token));
  return new AppError("gone", closedMessages[state === "open" ? "accepted" : state]);
}

async function newAccountFor(email: string, input: AcceptInvitationInput) {
  if (!("password" in input)) {
    throw new AppError("validation_failed", "Choose your name and a password to create your account.", {
      name: "Enter your name.",
      password: "Choose a password.",
    });
  }
  return { email, name: input.name, passwordHash: await hashPassword(input.password), ...(input.timeZone ? { timeZone: input.timeZone } : {}) };
}
