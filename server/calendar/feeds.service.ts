import { createHash, randomBytes } from "node:crypto";
import type { CalendarEntry } from "../../shared/calendar/entries";
import type { FeedScope, FeedSummary, NewFeed } from "../../shared/calendar/feeds";
import { LATEST_DATE } from "../../shared/fields/dates";
import { localDate } from "../../shared/slate/dates";
import type { Database } from "../db/client";
import { notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import type { CalendarSource } from "../seams/calendar-sources";
import { gatherEntries } from "./calendar.service";
import { renderFeed, type FeedItem } from "./feed-render";
import { feedsOfPerson, forgetCancelled, insertFeed, itemsOf, liveFeedByHash, revokeLiveFeed, writeItems, type ItemWrite } from "./feeds.repository";

const hashOf = (token: string) => createHash("sha256").update(token).digest("hex");
/** 32 random bytes, base64url: 43 characters. */
const tokenShape = /^[A-Za-z0-9_-]{43}$/;
export const feedUrl = (appUrl: string, token: string) => `${appUrl}/api/calendar-feeds/${token}/kerf.ics`;

/** A new secret address for the caller's feed in this channel; the one before it stops working. */
export async function makeFeed(db: Database, caller: Caller, scope: FeedScope, appUrl: string): Promise<NewFeed> {
  const token = randomBytes(32).toString("base64url");
  await db.transaction(async (tx) => {
    await revokeLiveFeed(tx, caller.channelId, caller.userId);
    await insertFeed(tx, { channelId: caller.channelId, userId: caller.userId, tokenHash: hashOf(token), scope });
  });
  return { url: feedUrl(appUrl, token), scope };
}

export async function endFeed(db: Database, caller: Caller): Promise<void> {
  if (!(await revokeLiveFeed(db, caller.channelId, caller.userId))) throw notFound("Calendar feed");
}

export async function feedsOf(db: Database, userId: string): Promise<FeedSummary[]> {
  const rows = await feedsOfPerson(db, userId);
  return rows.map((r) => ({ channelId: r.channelId, channelName: r.channelName, scope: r.scope, createdAt: r.createdAt?.toISOString() ?? null }));
}

const shiftDay = (date: string, days: number) => new Date(Date.parse(`${date}T00:00:00Z`) + days * 86_400_000).toISOString().slice(0, 10);
/** A feed holds three months back and everything ahead; what drops off its start is not "cancelled". */
const feedWindow = (today: string) => ({ from: shiftDay(today, -92), to: LATEST_DATE });
/** How long a withdrawn entry is still sent as cancelled, so every subscriber's app hears of it. */
const KEEP_CANCELLED_DAYS = 60;

/** The feed's own copy of an entry: nothing in it that changes without the entry changing. */
const forFeed = (entry: CalendarEntry): CalendarEntry => ({ ...entry, episodeVersion: null });
const digestOf = (entry: CalendarEntry) => createHash("sha256").update(JSON.stringify(entry)).digest("hex");

/**
 * Compares what the feed holds now with what it last sent: a changed entry gets SEQUENCE + 1, one that
 * left (its episode archived, its deal cancelled, its item removed, or no longer the member's) is sent
 * as cancelled with SEQUENCE + 1, and one that came back is live again.
 */
function reconcile(previous: Awaited<ReturnType<typeof itemsOf>>, current: CalendarEntry[], window: { from: string; to: string }): ItemWrite[] {
  const before = new Map(previous.map((item) => [item.key, item]));
  const writes: ItemWrite[] = [];
  for (const entry of current) {
    const digest = digestOf(entry);
    const was = before.get(entry.key);
    if (was && was.digest === digest && !was.cancelledAt) continue;
    writes.push({ key: entry.key, digest, sequence: was ? was.sequence + 1 : 0, entry, cancelled: false });
  }
  const now = new Set(current.map((e) => e.key));
  for (const item of previous) {
    const aged = item.entry.day < window.from;
    if (now.has(item.key) || item.cancelledAt || aged) continue;
    writes.push({ key: item.key, digest: item.digest, sequence: item.sequence + 1, entry: item.entry, cancelled: true });
  }
  return writes;
}

/** The iCalendar text of the feed a secret names, recording what changed since the last fetch; 404 for a revoked or unknown one. */
export async function feedText(db: Database, sources: readonly CalendarSource[], token: string, appUrl: string, now = new Date()): Promise<string> {
  if (!tokenShape.test(token)) throw notFound("Calendar feed");
  return db.transaction(async (tx) => {
    const feed = await liveFeedByHash(tx, hashOf(token));
    if (!feed) throw notFound("Calendar feed");
    const caller: Caller = { userId: feed.userId, name: feed.name, email: feed.email, emailVerified: feed.emailVerified, timeZone: feed.timeZone, channelId: feed.channelId, role: feed.role };
    const window = feedWindow(localDate(now, caller.timeZone));
    const all = (await gatherEntries(tx, sources, caller, window)).map(forFeed);
    const current = feed.scope === "mine" ? all.filter((e) => e.people.includes(feed.userId)) : all;
    await writeItems(tx, feed.id, reconcile(await itemsOf(tx, feed.id), current, window));
    await forgetCancelled(tx, feed.id, new Date(now.getTime() - KEEP_CANCELLED_DAYS * 86_400_000));
    const items: FeedItem[] = (await itemsOf(tx, feed.id))
      .filter((item) => item.entry.day >= window.from)
      .map((item) => ({ entry: item.entry, sequence: item.sequence, changedAt: item.changedAt, cancelled: item.cancelledAt !== null }))
      .sort((a, b) => a.entry.day.localeCompare(b.entry.day) || a.entry.key.localeCompare(b.entry.key));
    return renderFeed({ name: `Kerf: ${feed.channelName}`, channelId: feed.channelId, appUrl, items });
  });
}
