import { and, asc, count, eq, inArray, isNull } from "drizzle-orm";
import type { Database } from "../db/client";
import { memberships, users } from "../db/schema/accounts";
import { episodes } from "../db/schema/slate";
import { dealTemplates, deals, speakingRates, sponsorContacts, sponsorSettings, sponsors } from "../db/schema/sponsors";
import type { DealTemplate } from "../../shared/sponsors/schemas";
import { nextVersion } from "../db/versions";

// Every query here is scoped by channel: an id from another channel finds nothing (404).

export async function listSponsors(db: Database, channelId: string) {
  const rows = await db.select().from(sponsors).where(eq(sponsors.channelId, channelId)).orderBy(asc(sponsors.company));
  const ids = rows.map((r) => r.id);
  const contacts = ids.length === 0 ? [] : await db.select().from(sponsorContacts).where(inArray(sponsorContacts.sponsorId, ids)).orderBy(asc(sponsorContacts.name));
  const dealCounts =
    ids.length === 0
      ? []
      : await db.select({ sponsorId: deals.sponsorId, n: count() }).from(deals).where(inArray(deals.sponsorId, ids)).groupBy(deals.sponsorId);
  return rows.map((row) => ({
    ...row,
    contacts: contacts.filter((c) => c.sponsorId === row.id),
    dealCount: dealCounts.find((d) => d.sponsorId === row.id)?.n ?? 0,
  }));
}

export async function findSponsor(db: Database, channelId: string, sponsorId: string) {
  const [row] = await db
    .select()
    .from(sponsors)
    .where(and(eq(sponsors.id, sponsorId), eq(sponsors.channelId, channelId)));
  if (!row) return null;
  const contacts = await db.select().from(sponsorContacts).where(eq(sponsorContacts.sponsorId, sponsorId)).orderBy(asc(sponsorContacts.name));
  return { ...row, contacts };
}

export async function listSponsorDeals(db: Database, channelId: string, sponsorId: string) {
  return db
    .select({
      id: deals.id,
      version: deals.version,
      episodeId: deals.episodeId,
      episodeTitle: episodes.title,
      state: deals.state,
      placement: deals.placement,
      publishDate: episodes.targetPublishDate,
      feeAmount: deals.feeAmount,
      currency: deals.currency,
    })
    .from(deals)
    .leftJoin(episodes, eq(episodes.id, deals.episodeId))
    .where(and(eq(deals.channelId, channelId), eq(deals.sponsorId, sponsorId)))
    .orderBy(asc(episodes.targetPublishDate), asc(deals.createdAt));
}

/** The channel's episodes that aren't archived, soonest publish date first: where a waiting deal can be tied. */
export async function listOpenEpisodes(db: Database, channelId: string) {
  return db
    .select({ id: episodes.id, title: episodes.title, publishDate: episodes.targetPublishDate })
    .from(episodes)
    .where(and(eq(episodes.channelId, channelId), isNull(episodes.archivedAt)))
    .orderBy(asc(episodes.targetPublishDate), asc(episodes.title));
}

export async function insertSponsor(db: Database, channelId: string, input: { company: string; website: string | null; notes: string | null }) {
  const [row] = await db
    .insert(sponsors)
    .values({ channelId, ...input })
    .returning();
  return row!;
}

/** Saves a sponsor if it is still at `version`; null when it isn't (or isn't this channel's). */
export async function updateSponsor(db: Database, channelId: string, sponsorId: string, version: number, input: { company: string; website: string | null; notes: string | null }) {
  const [row] = await db
    .update(sponsors)
    .set({ ...input, version: nextVersion(sponsors.version), updatedAt: new Date() })
    .where(and(eq(sponsors.id, sponsorId), eq(sponsors.channelId, channelId), eq(sponsors.version, version)))
    .returning();
  return row ?? null;
}

export async function insertContact(db: Database, channelId: string, sponsorId: string, input: { name: string; email: string; role: string | null }) {
  const [row] = await db
    .insert(sponsorContacts)
    .values({ channelId, sponsorId, ...input })
    .returning();
  return row!;
}

/** Saves a contact if it is still at `version`; null when it isn't (or isn't this sponsor's). */
export async function updateContact(db: Database, channelId: string, sponsorId: string, contactId: string, version: number, input: { name: string; email: string; role: string | null }) {
  const [row] = await db
    .update(sponsorContacts)
    .set({ ...input, version: nextVersion(sponsorContacts.version) })
    .where(and(eq(sponsorContacts.id, contactId), eq(sponsorContacts.sponsorId, sponsorId), eq(sponsorContacts.channelId, channelId), eq(sponsorContacts.version, version)))
    .returning();
  return row ?? null;
}

export async function deleteContact(db: Database, channelId: string, sponsorId: string, contactId: string): Promise<boolean> {
  const rows = await db
    .delete(sponsorContacts)
    .where(and(eq(sponsorContacts.id, contactId), eq(sponsorContacts.sponsorId, sponsorId), eq(sponsorContacts.channelId, channelId)))
    .returning({ id: sponsorContacts.id });
  return rows.length > 0;
}

// ── Templates ──────────────────────────────────────────────────────────

const templateColumns = { id: dealTemplates.id, name: dealTemplates.name, items: dealTemplates.items, version: dealTemplates.version };

export async function listTemplates(db: Database, channelId: string) {
  return db.select(templateColumns).from(dealTemplates).where(eq(dealTemplates.channelId, channelId)).orderBy(asc(dealTemplates.name));
}

export async function findTemplate(db: Database, channelId: string, templateId: string) {
  const [row] = await db
    .select(templateColumns)
    .from(dealTemplates)
    .where(and(eq(dealTemplates.id, templateId), eq(dealTemplates.channelId, channelId)));
  return row ?? null;
}

export async function insertTemplate(db: Database, channelId: string, input: { name: string; items: DealTemplate["items"] }) {
  const [row] = await db.insert(dealTemplates).values({ channelId, ...input }).returning(templateColumns);
  return row!;
}

/** Saves a template if it is still at `version`; null when it isn't (or isn't this channel's). */
export async function updateTemplate(db: Database, channelId: string, templateId: string, version: number, input: { name: string; items: DealTemplate["items"] }) {
  const [row] = await db
    .update(dealTemplates)
    .set({ ...input, version: nextVersion(dealTemplates.version), updatedAt: new Date() })
    .where(and(eq(dealTemplates.id, templateId), eq(dealTemplates.channelId, channelId), eq(dealTemplates.version, version)))
    .returning(templateColumns);
  return row ?? null;
}

export async function deleteTemplate(db: Database, channelId: string, templateId: string): Promise<boolean> {
  const rows = await db
    .delete(dealTemplates)
    .where(and(eq(dealTemplates.id, templateId), eq(dealTemplates.channelId, channelId)))
    .returning({ id: dealTemplates.id });
  return rows.length > 0;
}

// ── Settings and speaking rates ────────────────────────────────────────

export const DEFAULT_REMINDER_DAYS_BEFORE = 2;

export async function reminderDaysBefore(db: Database, channelId: string): Promise<number> {
  const [row] = await db.select({ days: sponsorSettings.reminderDaysBefore }).from(sponsorSettings).where(eq(sponsorSettings.channelId, channelId));
  return row?.days ?? DEFAULT_REMINDER_DAYS_BEFORE;
}

export async function saveReminderDaysBefore(db: Database, channelId: string, days: number) {
  await db
    .insert(sponsorSettings)
    .values({ channelId, reminderDaysBefore: days })
    .onConflictDoUpdate({ target: sponsorSettings.channelId, set: { reminderDaysBefore: days, updatedAt: new Date() } });
}

export async function listMembersWithRates(db: Database, channelId: string) {
  return db
    .select({ userId: users.id, name: users.name, email: users.email, role: memberships.role, joinedAt: memberships.joinedAt, wordsPerMinute: speakingRates.wordsPerMinute })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .leftJoin(speakingRates, and(eq(speakingRates.channelId, memberships.channelId), eq(speakingRates.userId, memberships.userId)))
    .where(eq(memberships.channelId, channelId))
    .orderBy(asc(memberships.joinedAt));
}

export async function saveSpeakingRate(db: Database, channelId: string, userId: string, wordsPerMinute: number) {
  await db
    .insert(speakingRates)
    .values({ channelId, userId, wordsPerMinute })
    .onConflictDoUpdate({ target: [speakingRates.channelId, speakingRates.userId], set: { wordsPerMinute } });
}
