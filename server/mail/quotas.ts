import type { Database } from "../db/client";
import { AppError } from "../http/app-error";
import { lockScope, recordUse, usesSince } from "./quotas.repository";

/** Mail that members cause to be sent to other people (or, for confirmation, to themselves). */
export type MailPurpose = "invitation" | "review_link" | "sponsor_report" | "invoice" | "mention" | "verification" | "password_reset";

interface Allowance {
  limit: number;
  window: "hour" | "day";
}

const windowMs = { hour: 3_600_000, day: 86_400_000 } as const;
/** The longest window: sends older than this no longer count anywhere. */
export const LONGEST_WINDOW_MS = windowMs.day;

/**
 * How much mail one account and one channel may cause in any sliding hour or day. Sized for a small
 * studio's real use with room to spare: a new channel inviting its whole crew, a producer sending a
 * week's review links in an afternoon, a busy comment thread. They are Kerf's own choice, not from a
 * published source; docs/decisions/0008-mail-that-cannot-be-turned-on-others.md says why.
 * Reminders and a sponsor's decision are not counted: Kerf sends those once per item or per link.
 */
export const mailAllowances: Record<MailPurpose, { account: Allowance; channel?: Allowance }> = {
  invitation: { account: { limit: 30, window: "hour" }, channel: { limit: 60, window: "day" } },
  review_link: { account: { limit: 30, window: "hour" }, channel: { limit: 100, window: "day" } },
  sponsor_report: { account: { limit: 30, window: "hour" }, channel: { limit: 100, window: "day" } },
  invoice: { account: { limit: 30, window: "hour" }, channel: { limit: 100, window: "day" } },
  mention: { account: { limit: 60, window: "hour" }, channel: { limit: 300, window: "day" } },
  verification: { account: { limit: 3, window: "hour" } },
  // Counted per address asked about, whether or not an account has it, so the answer tells nothing.
  password_reset: { account: { limit: 5, window: "hour" } },
};

const nouns: Record<MailPurpose, string> = {
  invitation: "invitations",
  review_link: "review links",
  sponsor_report: "sponsor reports",
  invoice: "invoices",
  mention: "mails about mentions",
  verification: "confirmation mails",
  password_reset: "password links",
};

export type QuotaHolder = "account" | "channel";

export const quotaScope = (holder: QuotaHolder, id: string, purpose: MailPurpose) => `${holder}:${id}:${purpose}`;

function inWords(ms: number): string {
  const minutes = Math.max(1, Math.ceil(ms / 60_000));
  if (minutes < 60) return `${minutes} minute${minutes === 1 ? "" : "s"}`;
  const hours = Math.ceil(minutes / 60);
  return `${hours} hour${hours === 1 ? "" : "s"}`;
}

/** When enough of the window's sends will have aged out to make room for `count` more. */
function roomAt(uses: { mails: number; sentAt: Date }[], allowance: Allowance, count: number): Date {
  let toFree = uses.reduce((sum, use) => sum + use.mails, 0) + count - allowance.limit;
  for (const use of uses) {
    toFree -= use.mails;
    if (toFree <= 0) return new Date(use.sentAt.getTime() + windowMs[allowance.window]);
  }
  return new Date(Date.now() + windowMs[allowance.window]);
}

function overQuota(purpose: MailPurpose, holder: QuotaHolder, allowance: Allowance, retryAt: Date, now: Date): AppError {
  const wait = retryAt.getTime() - now.getTime();
  const per = allowance.window === "hour" ? "an hour" : "a day";
  return new AppError(
    "rate_limited",
    `Kerf sends at most ${allowance.limit} ${nouns[purpose]} ${per} for ${holder === "account" ? "one person" : "one channel"}, and that many have gone out. ` +
      `Nothing was sent; try again after ${retryAt.toISOString().slice(11, 16)} UTC (in ${inWords(wait)}).`,
    undefined,
    { retryAfterSeconds: Math.max(1, Math.ceil(wait / 1000)), retryAt: retryAt.toISOString() },
  );
}

/**
 * Counts `count` mails of one purpose against the sender's account and channel over the last hour or
 * day, or answers 429 saying when to try again. Call it inside the transaction that makes the mail
 * (it locks the scopes it counts until then): a refusal, or any later failure of that write, rolls
 * back every count it added.
 */
export async function takeMailQuota(tx: Database, purpose: MailPurpose, who: { userId: string; channelId?: string }, count = 1, now = new Date()): Promise<void> {
  if (count === 0) return;
  const allowances = mailAllowances[purpose];
  const checks: [QuotaHolder, string, Allowance][] = [["account", who.userId, allowances.account]];
  if (who.channelId && allowances.channel) checks.push(["channel", who.channelId, allowances.channel]);
  for (const [holder, id, allowance] of checks) {
    const scope = quotaScope(holder, id, purpose);
    await lockScope(tx, scope);
    const uses = await usesSince(tx, scope, new Date(now.getTime() - windowMs[allowance.window]));
    const used = uses.reduce((sum, use) => sum + use.mails, 0);
    if (used + count > allowance.limit) throw overQuota(purpose, holder, allowance, roomAt(uses, allowance, count), now);
    await recordUse(tx, scope, count, now);
  }
}
