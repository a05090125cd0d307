import type { OutgoingMail } from "./mailer";

/**
 * A mail waiting in the queue. It names what to send, not the finished message: the renderer of its
 * kind builds the mail when the job runs, so the recipient's membership and role, their current
 * address and the state of the link it carries are read at send time, and a link's secret is made
 * then too (the queue never holds one).
 */
export interface MailJob {
  /** Which renderer builds it (e.g. "invitation"). */
  kind: string;
  /** Whose share of the queue it takes: a channel's or an account's (channelShare, accountShare). */
  fairKey: string;
  data: unknown;
}

/** What a renderer decides at send time. */
export type MailPlan =
  | { send: OutgoingMail }
  /** Nothing goes out; the reason is recorded in the job's output. */
  | { skip: string }
  /** Other mails go out instead, each queued (and checked when sent) on its own. */
  | { instead: MailJob[] };

export type MailRenderer = (data: never) => Promise<MailPlan>;
export type MailRenderers = Readonly<Record<string, MailRenderer>>;

export const channelShare = (channelId: string) => `channel:${channelId}`;
export const accountShare = (userId: string) => `account:${userId}`;

/** A kind of mail: makes its jobs with typed data, and names the renderer that reads them back. */
export function mailKind<D>(kind: string) {
  return {
    kind,
    job: (data: D, fairKey: string): MailJob => ({ kind, fairKey, data }),
    renderer: (render: (data: D) => Promise<MailPlan>): MailRenderers => ({ [kind]: render as MailRenderer }),
  };
}
