import { and, asc, desc, eq, inArray, isNull, ne, notInArray, or, sql } from "drizzle-orm";
import type { Queryable } from "../db/client";
import { nextNumber } from "../db/counters";
import { nextVersion } from "../db/versions";
import { channels, users } from "../db/schema/accounts";
import { episodes } from "../db/schema/slate";
import { deals, deliverableEvents, deliverables, reviewLinks, speakingRates, sponsorContacts, sponsors } from "../db/schema/sponsors";

// Every query is scoped by channel: an id from another channel finds nothing and answers 404.

/** A database or a transaction: repositories take either. */
export type Db = Queryable;

export type DealRow = typeof deals.$inferSelect;
export type DeliverableRow = typeof deliverables.$inferSelect;
export type NewEvent = Omit<typeof deliverableEvents.$inferInsert, "id" | "at">;

const dealColumns = {
  deal: deals,
  episodeTitle: episodes.title,
  publishDate: episodes.targetPublishDate,
  company: sponsors.company,
};

export async function findDeal(db: Db, channelId: string, dealId: string) {
  const [row] = await db
    .select(dealColumns)
    .from(deals)
    .leftJoin(episodes, eq(episodes.id, deals.episodeId))
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .where(and(eq(deals.id, dealId), eq(deals.channelId, channelId)));
  return row ?? null;
}

export async function listEpisodeDeals(db: Db, channelId: string, episodeId: string) {
  return db
    .select(dealColumns)
    .from(deals)
    .innerJoin(episodes, eq(episodes.id, deals.episodeId))
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .where(and(eq(deals.channelId, channelId), eq(deals.episodeId, episodeId)))
    .orderBy(asc(deals.createdAt));
}

export async function findEpisodeInChannel(db: Db, channelId: string, episodeId: string) {
  const [row] = await db
    .select({ id: episodes.id, title: episodes.title, publishDate: episodes.targetPublishDate })
    .from(episodes)
    .where(and(eq(episodes.id, episodeId), eq(episodes.channelId, channelId)));
  return row ?? null;
}

/** Ties a deal that waits for its episode, if it is still at `version` and still waits; null otherwise. */
export async function tieDealRow(db: Db, channelId: string, dealId: string, version: number, episode: { id: string; publishDate: string | null }) {
  const [row] = await db
    .update(deals)
    .set({ episodeId: episode.id, publishBasis: episode.publishDate, version: nextVersion(deals.version), updatedAt: new Date() })
    .where(and(eq(deals.id, dealId), eq(deals.channelId, channelId), eq(deals.version, version), isNull(deals.episodeId)))
    .returning();
  return row ?? null;
}

export async function insertDeal(db: Db, values: typeof deals.$inferInsert) {
  const [row] = await db.insert(deals).values(values).returning();
  return row!;
}

/** Saves some of a deal's own fields if it is still at `version`; null when it isn't (or isn't this channel's). */
export async function updateDealRow(db: Db, channelId: string, dealId: string, version: number, values: Partial<typeof deals.$inferInsert>) {
  const [row] = await db
    .update(deals)
    .set({ ...values, version: nextVersion(deals.version), updatedAt: new Date() })
    .where(and(eq(deals.id, dealId), eq(deals.channelId, channelId), eq(deals.version, version)))
    .returning();
  return row ?? null;
}

export async function listContactsOf(db: Db, channelId: string, sponsorId: string) {
  return db
    .select({ id: sponsorContacts.id, name: sponsorContacts.name, email: sponsorContacts.email, role: sponsorContacts.role, version: sponsorContacts.version })
    .from(sponsorContacts)
    .where(and(eq(sponsorContacts.channelId, channelId), eq(sponsorContacts.sponsorId, sponsorId)))
    .orderBy(asc(sponsorContacts.name));
}

export async function findHost(db: Db, channelId: string, userId: string) {
  const [row] = await db
    .select({ id: users.id, name: users.name, wordsPerMinute: speakingRates.wordsPerMinute })
    .from(users)
    .leftJoin(speakingRates, and(eq(speakingRates.userId, users.id), eq(speakingRates.channelId, channelId)))
    .where(eq(users.id, userId));
  return row ?? null;
}

/** The episode's deals that aren't cancelled, with what the publish gates read. */
export async function liveDealsOfEpisode(db: Db, channelId: string, episodeId: string) {
  return db
    .select({ id: deals.id, company: sponsors.company, script: deals.script, descriptionCopy: deals.descriptionCopy, disclosureText: deals.disclosureText, link: deals.link, promoCode: deals.promoCode, goLiveDate: deals.goLiveDate, publishDate: episodes.targetPublishDate })
    .from(deals)
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .innerJoin(episodes, eq(episodes.id, deals.episodeId))
    .where(and(eq(deals.channelId, channelId), eq(deals.episodeId, episodeId), ne(deals.state, "cancelled")))
    .orderBy(asc(deals.createdAt));
}

// ── Deliverables and their history ─────────────────────────────────────

/** The items of these deals, each with how its date is counted. */
export async function itemsOfDeals(db: Db, channelId: string, dealIds: string[]) {
  if (dealIds.length === 0) return [];
  return db
    .select({ dealId: deliverables.dealId, title: deliverables.title, status: deliverables.status, anchor: deliverables.anchor, dueDate: deliverables.dueDate })
    .from(deliverables)
    .where(and(eq(deliverables.channelId, channelId), inArray(deliverables.dealId, dealIds)))
    .orderBy(asc(deliverables.position));
}

/** Every open deliverable of the channel's live deals on episodes that aren't archived, by due date: the desk. */
export async function openDeliverables(db: Db, channelId: string) {
  return db
    .select({
      id: deliverables.id,
      dealId: deliverables.dealId,
      episodeId: episodes.id,
      episodeTitle: episodes.title,
      sponsorId: deals.sponsorId,
      company: sponsors.company,
      kind: deliverables.kind,
      title: deliverables.title,
      dueDate: deliverables.dueDate,
      status: deliverables.status,
      version: deliverables.version,
      ownerName: users.name,
    })
    .from(deliverables)
    .innerJoin(deals, eq(deals.id, deliverables.dealId))
    .innerJoin(episodes, eq(episodes.id, deals.episodeId))
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .leftJoin(users, eq(users.id, deliverables.ownerId))
    .where(and(eq(deliverables.channelId, channelId), ne(deals.state, "cancelled"), isNull(episodes.archivedAt)))
    .orderBy(asc(deliverables.dueDate), asc(deliverables.position));
}

export async function listDeliverables(db: Db, channelId: string, dealIds: string[]) {
  if (dealIds.length === 0) return [];
  return db
    .select({ item: deliverables, ownerName: users.name })
    .from(deliverables)
    .leftJoin(users, eq(users.id, deliverables.ownerId))
    .where(and(eq(deliverables.channelId, channelId), inArray(deliverables.dealId, dealIds)))
    .orderBy(asc(deliverables.position), asc(deliverables.createdAt));
}

export async function findDeliverable(db: Db, channelId: string, deliverableId: string) {
  const [row] = await db
    .select({ item: deliverables, episodeId: deals.episodeId })
    .from(deliverables)
    .innerJoin(deals, eq(deals.id, deliverables.dealId))
    .where(and(eq(deliverables.id, deliverableId), eq(deliverables.channelId, channelId)));
  return row ?? null;
}

export async function insertDeliverables(db: Db, rows: (typeof deliverables.$inferInsert)[]) {
  if (rows.length === 0) return [];
  return db.insert(deliverables).values(rows).returning();
}

/**
 * Changes an item and raises its version; with `version`, only if the item is still at it (a
 * member's save), else whatever it is (a sponsor's decision, a review link sent or withdrawn).
 */
export async function updateDeliverableRow(db: Db, channelId: string, deliverableId: string, values: Partial<typeof deliverables.$inferInsert>, version?: number) {
  const [row] = await db
    .update(deliverables)
    .set({ ...values, version: nextVersion(deliverables.version), updatedAt: new Date() })
    .where(and(eq(deliverables.id, deliverableId), eq(deliverables.channelId, channelId), version === undefined ? undefined : eq(deliverables.version, version)))
    .returning();
  return row ?? null;
}

/**
 * The open items paired with one item: those that are the sponsor's approval of it, and the item it is
 * the approval of. Pairs are always within one deal, so the channel scope is the deal's.
 */
export async function openPairedItems(db: Db, channelId: string, deliverableId: string) {
  const approvedByIt = db.select({ id: deliverables.approvesId }).from(deliverables).where(and(eq(deliverables.id, deliverableId), eq(deliverables.channelId, channelId)));
  return db
    .select({ id: deliverables.id, status: deliverables.status })
    .from(deliverables)
    .where(
      and(
        eq(deliverables.channelId, channelId),
        notInArray(deliverables.status, ["approved", "done"]),
        or(eq(deliverables.approvesId, deliverableId), inArray(deliverables.id, approvedByIt)),
      ),
    );
}

export async function deleteDeliverableRow(db: Db, channelId: string, deliverableId: string): Promise<boolean> {
  const rows = await db
    .delete(deliverables)
    .where(and(eq(deliverables.id, deliverableId), eq(deliverables.channelId, channelId)))
    .returning({ id: deliverables.id });
  return rows.length > 0;
}

export async function nextPosition(db: Db, channelId: string, dealId: string): Promise<number> {
  const atLeast = sql`select coalesce(max(${deliverables.position}), -1) + 1 from ${deliverables} where ${deliverables.dealId} = ${dealId}`;
  return nextNumber(db, { scope: "deliverable_position", ownerId: dealId, channelId, atLeast });
}

export async function insertEvents(db: Db, events: NewEvent[]) {
  if (events.length === 0) return;
  await db.insert(deliverableEvents).values(events);
}

export async function listEvents(db: Db, channelId: string, deliverableIds: string[]) {
  if (deliverableIds.length === 0) return [];
  return db
    .select()
    .from(deliverableEvents)
    .where(and(eq(deliverableEvents.channelId, channelId), inArray(deliverableEvents.deliverableId, deliverableIds)))
    .orderBy(desc(deliverableEvents.at));
}

// ── Review links ───────────────────────────────────────────────────────

export async function listReviewLinks(db: Db, channelId: string, dealIds: string[]) {
  if (dealIds.length === 0) return [];
  return db
    .select({ link: reviewLinks, deliverableId: deliverables.id, deliverableTitle: deliverables.title, deliverableStatus: deliverables.status })
    .from(reviewLinks)
    .innerJoin(deliverables, eq(deliverables.id, reviewLinks.deliverableId))
    .where(and(eq(reviewLinks.channelId, channelId), inArray(reviewLinks.dealId, dealIds)))
    .orderBy(desc(reviewLinks.createdAt));
}

export async function insertReviewLink(db: Db, values: typeof reviewLinks.$inferInsert) {
  const [row] = await db.insert(reviewLinks).values(values).returning();
  return row!;
}

export async function revokeReviewLink(db: Db, channelId: string, dealId: string, linkId: string) {
  const [row] = await db
    .update(reviewLinks)
    .set({ revokedAt: new Date() })
    .where(and(eq(reviewLinks.id, linkId), eq(reviewLinks.dealId, dealId), eq(reviewLinks.channelId, channelId), sql`${reviewLinks.revokedAt} is null`))
    .returning();
  return row ?? null;
}

export async function findReviewLinkInDeal(db: Db, channelId: string, dealId: string, linkId: string) {
  const [row] = await db
    .select()
    .from(reviewLinks)
    .where(and(eq(reviewLinks.id, linkId), eq(reviewLinks.dealId, dealId), eq(reviewLinks.channelId, channelId)));
  return row ?? null;
}

/** The link a token names, with what its page shows; found by id alone (the token's signature vouches for it). */
export async function findReviewLinkForPage(db: Db, linkId: string) {
  // Links are sent only for deals tied to an episode, and a deal stays tied: the inner join finds it.
  const [row] = await db
    .select({ link: reviewLinks, deal: deals, channelName: channels.name, company: sponsors.company, episodeTitle: episodes.title, deliverableTitle: deliverables.title, deliverableStatus: deliverables.status })
    .from(reviewLinks)
    .innerJoin(deals, eq(deals.id, reviewLinks.dealId))
    .innerJoin(channels, eq(channels.id, reviewLinks.channelId))
    .innerJoin(sponsors, eq(sponsors.id, deals.sponsorId))
    .innerJoin(episodes, eq(episodes.id, deals.episodeId))
    .leftJoin(deliverables, eq(deliverables.id, reviewLinks.deliverableId))
    .where(eq(reviewLinks.id, linkId));
  return row ?? null;
}

/**
 * Locks what a decision depends on, in the order every writer takes them (deal, then item, then
 * link), and reads the link's page row: an edit of the deal or the item waits for the decision, or
 * the decision sees the edit.
 */
export async function lockReviewSubject(db: Db, linkId: string) {
  const [ids] = await db.select({ dealId: reviewLinks.dealId, deliverableId: reviewLinks.deliverableId }).from(reviewLinks).where(eq(reviewLinks.id, linkId));
  if (!ids) return null;
  await db.select({ id: deals.id }).from(deals).where(eq(deals.id, ids.dealId)).for("share");
  if (ids.deliverableId) await lockDeliverable(db, ids.deliverableId);
  await db.select({ id: reviewLinks.id }).from(reviewLinks).where(eq(reviewLinks.id, linkId)).for("update");
  return findReviewLinkForPage(db, linkId);
}

export async function lockDeliverable(db: Db, deliverableId: string) {
  await db.select({ id: deliverables.id }).from(deliverables).where(eq(deliverables.id, deliverableId)).for("update");
}

/** Records the decision only if the link is still open: the one place a second decision is refused. */
export async function claimReviewDecision(db: Db, linkId: string, decision: "approved" | "changes_asked", comment: string | null) {
  const [row] = await db
    .update(reviewLinks)
    .set({ decidedAt: new Date(), decision, comment })
    .where(and(eq(reviewLinks.id, linkId), sql`${reviewLinks.revokedAt} is null`, sql`${reviewLinks.decidedAt} is null`, sql`${reviewLinks.expiresAt} > now()`))
    .returning();
  return row ?? null;
}

/** Deals whose open items were dated from a publish date the episode no longer has. */
export async function dealsBehindPublishDate(db: Db, channelId: string | null) {
  return db
    .select({ dealId: deals.id, channelId: deals.channelId, episodeId: episodes.id })
    .from(deals)
    .innerJoin(episodes, eq(episodes.id, deals.episodeId))
    .where(
      and(
        channelId === null ? undefined : eq(deals.channelId, channelId),
        ne(deals.state, "cancelled"),
        sql`${deals.publishBasis} is distinct from ${episodes.targetPublishDate}`,
      ),
    );
}

/** The days after go-live on which the episode's live deals want their figures report. */
export async function reportDaysOfEpisode(db: Db, channelId: string, episodeId: string): Promise<number[]> {
  const rows = await db
    .selectDistinct({ days: deliverables.offsetDays })
    .from(deliverables)
    .innerJoin(deals, eq(deals.id, deliverables.dealId))
    .where(and(eq(deals.channelId, channelId), eq(deals.episodeId, episodeId), ne(deals.state, "cancelled"), eq(deliverables.kind, "report"), eq(deliverables.anchor, "after_go_live")));
  return rows.map((row) => row.days);
}
