import { roleMay, rolesAllowed, type Area, type Need } from "../../shared/access/roles";
import type { MailTopic } from "../../shared/auth/account";
import type { Database } from "../db/client";
import { channelShare, mailKind, type MailRenderers } from "./mail-jobs";
import { findMemberAddress, listMembersInRoles } from "./recipients.repository";
import { writeMoments } from "./times";

/** What the recipient must still be allowed to do, in the spec's role table, when the mail goes out. */
export interface Permission {
  area: Area;
  need: Need;
}

export interface MemberMail {
  channelId: string;
  /** null when the account is gone: the mail goes to `otherwise`, or nowhere. */
  userId: string | null;
  needs: Permission;
  /**
   * When the recipient has left or lost the role: the members who now hold this permission get the
   * mail instead (a sponsor's decision reaches the channel's current producers), with `note` added.
   */
  otherwise?: Permission & { note: string };
  /** What the mail is about: a recipient who turned that topic off on their account page gets nothing. */
  topic: MailTopic;
  subject: string;
  /** Moments in it are `momentFor(at)`: written when the mail is sent, in the recipient's time zone. */
  text: string;
}

/**
 * Mail to a member of a channel (mentions, reminders, a sponsor's decision). The address and the
 * membership are read when the mail is sent, not when it was queued: a removed member gets nothing.
 */
export const memberMailKind = mailKind<MemberMail>("member");

export const memberMail = (mail: MemberMail) => memberMailKind.job(mail, channelShare(mail.channelId));

export function memberMailRenderer(db: Database): MailRenderers {
  return memberMailKind.renderer(async (mail) => {
    const member = mail.userId ? await findMemberAddress(db, mail.channelId, mail.userId) : null;
    if (member?.mailOptOuts.includes(mail.topic)) return { skip: `the recipient turned off mail about ${mail.topic}` };
    if (member && roleMay(member.role, mail.needs.area, mail.needs.need)) {
      return { send: { to: member.email, subject: mail.subject, text: writeMoments(mail.text, member.timeZone) } };
    }
    const reason = member ? "the recipient's role no longer allows it" : "the recipient is no longer a member";
    if (!mail.otherwise) return { skip: reason };
    const { note, ...needs } = mail.otherwise;
    const others = (await listMembersInRoles(db, mail.channelId, rolesAllowed(needs.area, needs.need))).filter((m) => m.userId !== mail.userId);
    if (others.length === 0) return { skip: `${reason}, and nobody holds the role now` };
    const text = `${mail.text}\n\n${note}`;
    return { instead: others.map((other) => memberMail({ channelId: mail.channelId, userId: other.userId, needs, topic: mail.topic, subject: mail.subject, text })) };
  });
}
