import { pageSettingsSchema, publicSuggestionSchema, type PageSettings } from "../../shared/intake/schemas";
import type { Database } from "../db/client";
import { inTransaction } from "../db/transaction";
import { AppError } from "../http/app-error";
import { parseBody } from "../http/validate";
import type { Jobs } from "../jobs/queue";
import { channelShare } from "../mail/mail-jobs";
import { hashLinkToken } from "../mail/link-tokens";
import { fileSuggestion } from "./grouping";
import { lockChannelGrouping } from "./grouping.repository";
import { confirmMail } from "./intake.mail";
import type { NewsTokens } from "./news-token";
import { addressKey, takePageHit, type PageLimits } from "./page-limits";
import { confirmByHash, contactFor, pageOf, savePage, unsubscribe } from "./page.repository";

export interface PageContext {
  db: Database;
  jobs: Pick<Jobs, "enqueueMail">;
  limits: PageLimits;
  tokens: NewsTokens;
}

/** Every answer to a visitor's suggestion looks the same, whether it was kept or caught by the trap. */
const RECEIVED = { received: true, message: "Thank you: the channel has your suggestion." } as const;

const closed = () => new AppError("not_found", "This suggestion page is closed.");

/** What a visitor sees: the channel's name and prompt, nothing else. */
export async function publicPage(db: Database, channelId: string): Promise<{ name: string; prompt: string }> {
  const page = await pageOf(db, channelId);
  if (!page?.open) throw closed();
  return { name: page.name, prompt: page.prompt };
}

const trapped = (body: unknown) => {
  const nickname = (body as { nickname?: unknown } | null)?.nickname;
  return typeof nickname === "string" && nickname.trim() !== "";
};

/**
 * A visitor's suggestion: trapped robots get the usual answer and nothing is kept; otherwise the
 * address's allowance is counted, the suggestion is grouped, and an address given with consent gets
 * one confirmation mail (queued in the same transaction).
 */
export async function submitSuggestion(ctx: PageContext, channelId: string, address: string, body: unknown): Promise<typeof RECEIVED> {
  if (trapped(body)) return RECEIVED;
  const input = parseBody(publicSuggestionSchema, body);
  await inTransaction(ctx.db, async (tx, sql) => {
    const page = await pageOf(tx, channelId);
    if (!page?.open) throw closed();
    await takePageHit(tx, ctx.limits, channelId, address);
    await lockChannelGrouping(tx, channelId);
    const contact = input.email ? await contactFor(tx, channelId, input.email) : null;
    const personKey = input.email ? `mail:${input.email}` : `page:${addressKey(address)}`;
    await fileSuggestion(tx, channelId, { text: input.text, source: "page", personKey, contactId: contact?.id ?? null });
    if (contact?.made) await ctx.jobs.enqueueMail(confirmMail.job({ contactId: contact.id }, channelShare(channelId)), { db: sql });
  });
  return RECEIVED;
}

export async function confirmAddress(db: Database, token: string): Promise<{ channelName: string }> {
  const found = await confirmByHash(db, hashLinkToken(token));
  if (!found) throw new AppError("not_found", "This link has been used or is not valid. Your address may already be confirmed.");
  return found;
}

export async function stopNews(db: Database, tokens: NewsTokens, token: string): Promise<void> {
  const contactId = tokens.read(token);
  if (!contactId || !(await unsubscribe(db, contactId))) throw new AppError("not_found", "This link is not valid.");
}

export async function pageSettings(db: Database, channelId: string): Promise<PageSettings> {
  const page = await pageOf(db, channelId);
  return { open: page?.open ?? false, prompt: page?.prompt ?? "" };
}

export async function changePageSettings(db: Database, channelId: string, body: unknown): Promise<PageSettings> {
  const input = parseBody(pageSettingsSchema, body);
  await savePage(db, channelId, input);
  return input;
}
