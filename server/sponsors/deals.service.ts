import { randomUUID } from "node:crypto";
import { roleMay, type Role } from "../../shared/access/roles";
import { minorUnitDigits } from "../../shared/money/minor-units";
import { dateInZone } from "../../shared/sponsors/dates";
import { generateDeliverables, pairedByTemplate, isCutKind, type DeliverableKind, isMoneyKind, latenessOf, type TemplateItem } from "../../shared/sponsors/deliverables";
import { checkDisclosure } from "../../shared/sponsors/disclosure";
import { DEFAULT_WORDS_PER_MINUTE, analyseRead, measuredSeconds, mentionsCode, mentionsLink } from "../../shared/sponsors/read";
import type { DealView, DeliverableEvent, DeliverableView, Money, ReviewLinkView } from "../../shared/sponsors/schemas";
import type { createDealSchema, cutSchema, tieDealSchema, updateDealSchema } from "../../shared/sponsors/schemas";
import { segmentProblems } from "../../shared/sponsors/segment";
import { frameRates, type FrameRateName } from "../../shared/timecode/rates";
import type { z } from "zod";
import { isMember } from "../db/channel-scope";
import type { Database } from "../db/client";
import { AppError, notFound, staleSave } from "../http/app-error";
import type { Caller } from "../http/route-table";
import { findCutClips, listDealPins, listEpisodeClips } from "./cut.repository";
import { clipRateName, pinLabel, pinViewOf, segmentClipOf, segmentOf } from "./cut.service";
import {
  findDeal,
  findEpisodeInChannel,
  findHost,
  insertDeal,
  insertDeliverables,
  insertEvents,
  listContactsOf,
  listDeliverables,
  listEvents,
  listReviewLinks,
  tieDealRow,
  updateDealRow,
  type DealRow,
  type Db,
} from "./deals.repository";
import { redateDeal, type Actor } from "./schedule.service";
import { findSponsor, findTemplate, listMembersWithRates } from "./sponsors.repository";
import { linkStateOf } from "./review-token";

export const seesFees = (role: Role) => roleMay(role, "fees", "R");
export const runsDeliverables = (role: Role) => roleMay(role, "deliverables", "W");
/** Whoever delivers the cut (the role table's "cut": the editor too) attaches it, measures the segment and moves the cut items. */
export const deliversCut = (role: Role) => roleMay(role, "cut", "W");

/** Whether a role may change an item: those who run deliverables any item, whoever delivers the cut the cut items. */
export const mayChangeItem = (role: Role, kind: DeliverableKind) => runsDeliverables(role) || (deliversCut(role) && isCutKind(kind));

export const actorOf = (caller: Caller): Actor => ({ id: caller.userId, name: caller.name, kind: "member" });

/** The start of a history entry the caller made on an item. */
export const eventBy = (caller: Caller, deliverableId: string) =>
  ({ channelId: caller.channelId, deliverableId, actorId: caller.userId, actorName: caller.name, actorKind: "member" }) as const;

/** A deal's money as its columns. */
const moneyColumns = (money: Money) => ({
  feeAmount: money.fee.toFixed(minorUnitDigits(money.currency)),
  currency: money.currency,
  paymentTermsDays: money.paymentTermsDays,
  paymentTermsFrom: money.paymentTermsFrom,
  invoiceNumber: money.invoiceNumber,
  invoicedOn: money.invoicedOn,
  paidOn: money.paidOn,
});

type DealWithJoins = NonNullable<Awaited<ReturnType<typeof findDeal>>>;

function moneyOf(deal: DealRow): Money {
  return {
    fee: Number(deal.feeAmount),
    currency: deal.currency,
    paymentTermsDays: deal.paymentTermsDays,
    paymentTermsFrom: deal.paymentTermsFrom,
    invoiceNumber: deal.invoiceNumber,
    invoicedOn: deal.invoicedOn,
    paidOn: deal.paidOn,
  };
}

function cutTimingOf(deal: DealRow): DealView["cut"]["timing"] {
  if (!deal.cutIn || !deal.cutOut || !deal.cutFrameRate) return null;
  const rate = frameRates[deal.cutFrameRate as FrameRateName];
  if (!rate) return null;
  const format = { rate, dropFrame: deal.cutDropFrame ?? false };
  return { inTimecode: deal.cutIn, outTimecode: deal.cutOut, frameRate: deal.cutFrameRate, dropFrame: format.dropFrame, measuredSeconds: measuredSeconds(deal.cutIn, deal.cutOut, format) };
}

/**
 * The deals as this caller may see them. Editor and crew get the segment's requirements and the
 * items they may read; the fee, payment terms and the invoice and payment items are left out of the
 * answer altogether (not blanked), and review links go only to the roles that send them.
 */
export async function dealViews(db: Db, caller: Caller, rows: DealWithJoins[], now = new Date()): Promise<DealView[]> {
  const dealIds = rows.map((r) => r.deal.id);
  const today = dateInZone(now, caller.timeZone);
  const fees = seesFees(caller.role);
  const items = (await listDeliverables(db, caller.channelId, dealIds)).filter((row) => fees || !isMoneyKind(row.item.kind));
  const events = await listEvents(db, caller.channelId, items.map((row) => row.item.id));
  const links = runsDeliverables(caller.role) ? await listReviewLinks(db, caller.channelId, dealIds) : [];
  const clipIds = rows.map((r) => r.deal.cutClipId).filter((id): id is string => id !== null);
  const cutClips = await findCutClips(db, caller.channelId, clipIds);
  const episodeIds = [...new Set(rows.map((r) => r.deal.episodeId).filter((id): id is string => id !== null))];
  const choices = deliversCut(caller.role) ? await listEpisodeClips(db, caller.channelId, episodeIds) : [];
  // The sponsor's pinned comments go to whoever sends the review or delivers the cut.
  const pins = runsDeliverables(caller.role) || deliversCut(caller.role) ? await listDealPins(db, caller.channelId, dealIds) : [];

  const views: DealView[] = [];
  for (const row of rows) {
    const deal = row.deal;
    const contacts = await listContactsOf(db, caller.channelId, deal.sponsorId);
    const host = deal.hostId ? await findHost(db, caller.channelId, deal.hostId) : null;
    const wordsPerMinute = host?.wordsPerMinute ?? DEFAULT_WORDS_PER_MINUTE;
    const description = deal.descriptionCopy ?? "";
    const clip = cutClips.find((c) => c.id === deal.cutClipId);
    const view: DealView = {
      id: deal.id,
      version: deal.version,
      episodeId: deal.episodeId,
      episodeTitle: row.episodeTitle,
      publishDate: row.publishDate,
      sponsor: { id: deal.sponsorId, company: row.company },
      contact: contacts.find((c) => c.id === deal.contactId) ?? null,
      contacts,
      state: deal.state,
      placement: deal.placement,
      segmentSeconds: deal.segmentSeconds,
      talkingPoints: deal.talkingPoints,
      link: deal.link,
      promoCode: deal.promoCode,
      disclosureText: deal.disclosureText,
      exclusivityNotes: deal.exclusivityNotes,
      descriptionCopy: deal.descriptionCopy,
      script: deal.script,
      goLiveDate: deal.goLiveDate,
      host: { id: host?.id ?? null, name: host?.name ?? null, wordsPerMinute },
      read: analyseRead({ script: deal.script, wordsPerMinute, contractedSeconds: deal.segmentSeconds, talkingPoints: deal.talkingPoints, link: deal.link, promoCode: deal.promoCode }),
      disclosure: {
        ...checkDisclosure({ script: deal.script, description, wording: deal.disclosureText }),
        linkInDescription: deal.link ? mentionsLink(description, deal.link) : null,
        codeInDescription: deal.promoCode ? mentionsCode(description, deal.promoCode) : null,
      },
      cut: {
        clip: clip ? { id: clip.id, fileName: clip.fileName, durationSeconds: clip.durationMs / 1000, frameRate: clipRateName(clip) } : null,
        timing: cutTimingOf(deal),
        segment: clip ? segmentOf(clip, deal) : null,
        ...(runsDeliverables(caller.role) || deliversCut(caller.role)
          ? {
              pins: pins
                .filter((p) => p.pin.dealId === deal.id)
                .map(({ pin, deliverableTitle }) => ({ ...pinViewOf(pin), timecode: pinLabel(clip ?? null, deal, pin.offsetMs / 1000), deliverableTitle })),
            }
          : {}),
      },
      deliverables: items
        .filter((i) => i.item.dealId === deal.id)
        .map(({ item, ownerName }): DeliverableView => ({
          id: item.id,
          dealId: item.dealId,
          kind: item.kind,
          title: item.title,
          anchor: item.anchor,
          offsetDays: item.offsetDays,
          dueDate: item.dueDate,
          status: item.status,
          ownerId: item.ownerId,
          ownerName,
          version: item.version,
          ...latenessOf(item, today),
          canEdit: mayChangeItem(caller.role, item.kind),
          history: events
            .filter((e) => e.deliverableId === item.id)
            .map((e): DeliverableEvent => ({
              id: e.id,
              at: e.at.toISOString(),
              actorName: e.actorName,
              actorKind: e.actorKind,
              what: e.what,
              fromStatus: e.fromStatus,
              toStatus: e.toStatus,
              fromDate: e.fromDate,
              toDate: e.toDate,
              note: e.note,
            })),
        })),
    };
    if (runsDeliverables(caller.role)) {
      view.reviewLinks = links
        .filter((l) => l.link.dealId === deal.id)
        .map(({ link, deliverableId, deliverableTitle, deliverableStatus }): ReviewLinkView => ({
          id: link.id,
          deliverableId,
          deliverableTitle,
          contactName: link.contactName,
          contactEmail: link.contactEmail,
          sentByName: link.sentByName,
          sentAt: link.createdAt.toISOString(),
          expiresAt: link.expiresAt.toISOString(),
          state: linkStateOf(link, { contactId: link.contactId, dealState: deal.state, itemStatus: deliverableStatus }, now),
          decision: link.decision,
          comment: link.comment,
          decidedAt: link.decidedAt?.toISOString() ?? null,
        }));
    }
    if (deliversCut(caller.role)) view.cutChoices = choices.filter((c) => c.episodeId === deal.episodeId).map((c) => ({ id: c.id, fileName: c.fileName, frameRate: clipRateName(c), dropFrame: c.dropFrame, startTimecode: c.startTimecode }));
    if (fees) view.money = moneyOf(deal);
    views.push(view);
  }
  return views;
}

export async function dealView(db: Db, caller: Caller, dealId: string): Promise<DealView> {
  const row = await findDeal(db, caller.channelId, dealId);
  if (!row) throw notFound("Deal");
  const [view] = await dealViews(db, caller, [row]);
  return view!;
}

async function checkReferences(db: Database, channelId: string, sponsorId: string, input: { contactId?: string | null; hostId?: string | null }) {
  if (input.contactId) {
    const contacts = await listContactsOf(db, channelId, sponsorId);
    if (!contacts.some((c) => c.id === input.contactId)) throw new AppError("validation_failed", "Some fields need attention.", { contactId: "Pick one of this sponsor's contacts." });
  }
  if (input.hostId && !(await isMember(db, channelId, input.hostId))) {
    throw new AppError("validation_failed", "Some fields need attention.", { hostId: "Pick a member of this channel as the host." });
  }
}

/** Picks the member a template item names by role: the deal's maker if the role is theirs, else the longest-standing. */
function ownerFor(item: TemplateItem, caller: Caller, members: { userId: string; role: Role }[]): string {
  if (item.ownerRole === null || item.ownerRole === caller.role) return caller.userId;
  return members.find((m) => m.role === item.ownerRole)?.userId ?? caller.userId;
}

const notThisChannels = () => new AppError("validation_failed", "Some fields need attention.", { episodeId: "Pick an episode of this channel." });

export async function createDeal(db: Database, caller: Caller, input: z.output<typeof createDealSchema>): Promise<DealView> {
  // Without an episode the deal waits: its items have no publish date to count from yet.
  const episode = input.episodeId === null ? { publishDate: null } : await findEpisodeInChannel(db, caller.channelId, input.episodeId);
  if (!episode) throw notThisChannels();
  const sponsor = await findSponsor(db, caller.channelId, input.sponsorId);
  if (!sponsor) throw new AppError("validation_failed", "Some fields need attention.", { sponsorId: "Pick a sponsor of this channel." });
  await checkReferences(db, caller.channelId, sponsor.id, input);
  const template = input.templateId ? await findTemplate(db, caller.channelId, input.templateId) : null;
  if (input.templateId && !template) throw new AppError("validation_failed", "Some fields need attention.", { templateId: "Pick one of the channel's templates." });
  const members = await listMembersWithRates(db, caller.channelId);

  // The deal, its items, their history and the answer built from them: all or nothing.
  return db.transaction(async (tx) => {
    const { money, templateId: _templateId, ...segment } = input;
    const deal = await insertDeal(tx, {
      ...segment,
      channelId: caller.channelId,
      publishBasis: episode.publishDate,
      ...moneyColumns(money),
      createdBy: caller.userId,
    });
    const generated = generateDeliverables(template?.items ?? [], { publishDate: episode.publishDate, goLiveDate: deal.goLiveDate });
    const inserted = await insertDeliverables(
      tx,
      pairedByTemplate(generated, generated.map(() => randomUUID())).map((item) => ({
        id: item.id,
        approvesId: item.approvesId,
        channelId: caller.channelId,
        dealId: deal.id,
        kind: item.kind,
        title: item.title,
        anchor: item.anchor,
        offsetDays: item.offsetDays,
        dueDate: item.dueDate,
        position: item.position,
        ownerId: ownerFor(item, caller, members),
      })),
    );
    await insertEvents(
      tx,
      inserted.map((item) => ({
        ...eventBy(caller, item.id),
        what: "created" as const,
        toStatus: item.status,
        toDate: item.dueDate,
        note: template ? `From the template "${template.name}"` : null,
      })),
    );
    return dealView(tx, caller, deal.id);
  });
}

/**
 * Ties a deal recorded against its sponsor to its episode: from then on its open items are dated from
 * the episode's publish date (they keep waiting while the episode has none) and follow it as it moves.
 */
export async function tieDeal(db: Database, caller: Caller, dealId: string, version: number, input: z.output<typeof tieDealSchema>): Promise<DealView> {
  const current = await findDeal(db, caller.channelId, dealId);
  if (!current) throw notFound("Deal");
  if (current.deal.episodeId !== null) throw new AppError("conflict", `This deal is already tied to "${current.episodeTitle}".`);
  const episode = await findEpisodeInChannel(db, caller.channelId, input.episodeId);
  if (!episode) throw notThisChannels();
  return db.transaction(async (tx) => {
    const tied = await tieDealRow(tx, caller.channelId, dealId, version, episode);
    if (!tied) throw await staleDeal(tx, caller, dealId);
    await redateDeal(tx, tied, episode.publishDate, actorOf(caller), `Tied to the episode "${episode.title}"`);
    return dealView(tx, caller, dealId);
  });
}

/** A deal's save that matched no row: someone saved it since `version` (409 with the deal as it is now), or it is gone. */
const staleDeal = async (db: Db, caller: Caller, dealId: string) => staleSave("deal", await dealView(db, caller, dealId));

export async function updateDeal(db: Database, caller: Caller, dealId: string, version: number, input: z.output<typeof updateDealSchema>): Promise<DealView> {
  const current = await findDeal(db, caller.channelId, dealId);
  if (!current) throw notFound("Deal");
  if (current.deal.version !== version) throw await staleDeal(db, caller, dealId);
  await checkReferences(db, caller.channelId, current.deal.sponsorId, input);
  return db.transaction(async (tx) => {
    const updated = await updateDealRow(tx, caller.channelId, dealId, version, input);
    if (!updated) throw await staleDeal(tx, caller, dealId);
    if (input.goLiveDate !== undefined && input.goLiveDate !== current.deal.goLiveDate) {
      const note = updated.goLiveDate ? `Go-live set to ${updated.goLiveDate}` : "Go-live follows the publish date again";
      await redateDeal(tx, updated, current.publishDate, actorOf(caller), note);
    }
    return dealView(tx, caller, dealId);
  });
}

export async function updateMoney(db: Database, caller: Caller, dealId: string, version: number, money: Money): Promise<DealView> {
  return db.transaction(async (tx) => {
    if (!(await updateDealRow(tx, caller.channelId, dealId, version, moneyColumns(money)))) throw await staleDeal(tx, caller, dealId);
    return dealView(tx, caller, dealId);
  });
}

export async function updateCut(db: Database, caller: Caller, dealId: string, version: number, input: z.output<typeof cutSchema>): Promise<DealView> {
  const current = await findDeal(db, caller.channelId, dealId);
  if (!current) throw notFound("Deal");
  if (input.clipId) {
    const [clip] = await findCutClips(db, caller.channelId, [input.clipId]);
    if (!clip || clip.episodeId !== current.deal.episodeId) throw new AppError("validation_failed", "Some fields need attention.", { clipId: "Pick a clip of this episode's footage." });
    // The in and out are the clip's own frames: its frame rate, within its first and last frame.
    const problems = input.timing ? segmentProblems(segmentClipOf(clip), input.timing) : null;
    if (problems) throw new AppError("validation_failed", "Some fields need attention.", problems);
  }
  return db.transaction(async (tx) => {
    const saved = await updateDealRow(tx, caller.channelId, dealId, version, {
      cutClipId: input.clipId,
      cutIn: input.timing?.inTimecode ?? null,
      cutOut: input.timing?.outTimecode ?? null,
      cutFrameRate: input.timing?.frameRate ?? null,
      cutDropFrame: input.timing?.dropFrame ?? null,
    });
    if (!saved) throw await staleDeal(tx, caller, dealId);
    return dealView(tx, caller, dealId);
  });
}
