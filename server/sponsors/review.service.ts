import { createHash } from "node:crypto";
import { formatInstantNamingZone } from "../../shared/fields/written-dates";
import { momentFor } from "../mail/times";
import { addDays } from "date-fns";
import { DEFAULT_WORDS_PER_MINUTE, countWords, readSeconds } from "../../shared/sponsors/read";
import { deliverableStatusLabels, isMoneyKind, isSettled } from "../../shared/sponsors/deliverables";
import { PINS_PER_LINK, PINS_PER_MINUTE, type ReviewDecision, type ReviewLinkView, type ReviewPage, type ReviewPinView, type ReviewSegment, type reviewDecisionSchema, type reviewPinSchema, type sendReviewSchema } from "../../shared/sponsors/schemas";
import type { z } from "zod";
import type { Database } from "../db/client";
import { inTransaction } from "../db/transaction";
import { AppError, notFound } from "../http/app-error";
import type { Jobs } from "../jobs/queue";
import { channelShare, mailKind, type MailRenderers } from "../mail/mail-jobs";
import { memberMail } from "../mail/member-mail";
import { takeMailQuota } from "../mail/quotas";
import { requireConfirmedAddress } from "../mail/senders";
import type { Storage } from "../storage/storage";
import { countLinkPins, insertReviewPin, listLinkPins } from "./cut.repository";
import { cutClipOf, playUrlOf, pinViewOf, segmentOf } from "./cut.service";
import {
  claimReviewDecision,
  findDeal,
  findDeliverable,
  findHost,
  findReviewLinkForPage,
  findReviewLinkInDeal,
  insertEvents,
  insertReviewLink,
  listContactsOf,
  lockDeliverable,
  lockReviewSubject,
  revokeReviewLink,
  updateDeliverableRow,
} from "./deals.repository";
import type { Caller } from "../http/route-table";
import { eventBy } from "./deals.service";
import { approvePairedItems } from "./deliverables.service";
import { closureOf, linkStateOf, type ReviewClosure, type ReviewTokens } from "./review-token";

export interface ReviewDeps {
  db: Database;
  appUrl: string;
  tokens: ReviewTokens;
  storage: Storage | null;
  jobs: Pick<Jobs, "enqueueMail">;
}

/**
 * The mail that carries a review link to the sponsor's contact. It holds only Kerf's own words and
 * the names involved (channel, sender, company, episode, item): no text of the sender's choosing
 * reaches an outside address under Kerf's name. It is built when sent, and only while the link is open.
 */
const reviewLinkMail = mailKind<{ linkId: string }>("review-link");

const invalidLink = () => new AppError("not_found", "This review link is not valid. Check that you copied all of it, or ask the channel for a new one.");

const reviewUrl = (appUrl: string, token: string) => `${appUrl}/review/${token}`;

const decisionWords: Record<ReviewDecision, string> = { approved: "approved", changes_asked: "asked for changes to" };

/** Sends one deal's review link to one of the sponsor's contacts; the item under review waits on the sponsor. */
export async function sendReviewLink(deps: ReviewDeps, caller: Caller, dealId: string, input: z.output<typeof sendReviewSchema>): Promise<{ link: ReviewLinkView; url: string }> {
  const { db } = deps;
  requireConfirmedAddress(caller);
  const deal = await findDeal(db, caller.channelId, dealId);
  if (!deal) throw notFound("Deal");
  if (deal.deal.state === "cancelled") throw new AppError("conflict", "This deal is cancelled: there is nothing left for the sponsor to review.");
  if (deal.deal.episodeId === null) throw new AppError("conflict", "Tie this deal to its episode first: the sponsor reviews the episode's segment.");
  const target = await findDeliverable(db, caller.channelId, input.deliverableId);
  if (!target || target.item.dealId !== dealId || isMoneyKind(target.item.kind)) {
    throw new AppError("validation_failed", "Some fields need attention.", { deliverableId: "Pick one of this deal's items for the sponsor to review." });
  }
  if (isSettled(target.item.status)) {
    const label = deliverableStatusLabels[target.item.status];
    throw new AppError("validation_failed", "Some fields need attention.", { deliverableId: `This item is already settled (${label}); pick one still open.` });
  }
  const contact = (await listContactsOf(db, caller.channelId, deal.deal.sponsorId)).find((c) => c.id === input.contactId);
  if (!contact) throw new AppError("validation_failed", "Some fields need attention.", { contactId: "Pick one of this sponsor's contacts." });
  const sender = await findHost(db, caller.channelId, caller.userId);
  // Whole seconds: the token carries the expiry in seconds and must match the row exactly.
  const expiresAt = new Date(Math.floor(addDays(new Date(), input.expiresInDays).getTime() / 1000) * 1000);

  // The link, the item's new state, its history, the mail allowance and the queued mail: all or nothing.
  const link = await inTransaction(db, async (tx, sql) => {
    await takeMailQuota(tx, "review_link", caller);
    const row = await insertReviewLink(tx, {
      channelId: caller.channelId,
      dealId,
      deliverableId: target.item.id,
      contactId: contact.id,
      contactName: contact.name,
      contactEmail: contact.email,
      sentBy: caller.userId,
      sentByName: sender?.name ?? caller.name,
      sentByEmail: caller.email,
      expiresAt,
    });
    await updateDeliverableRow(tx, caller.channelId, target.item.id, { status: "sent" });
    await insertEvents(tx, [
      {
        ...eventBy(caller, target.item.id),
        what: "review_sent",
        fromStatus: target.item.status,
        toStatus: "sent",
        note: `Review link sent to ${contact.name} <${contact.email}>, open until ${expiresAt.toISOString().slice(0, 10)}`,
      },
    ]);
    await deps.jobs.enqueueMail(reviewLinkMail.job({ linkId: row.id }, channelShare(caller.channelId)), { db: sql });
    return row;
  });

  return {
    url: reviewUrl(deps.appUrl, deps.tokens.sign(link.id, link.expiresAt)),
    link: {
      id: link.id,
      deliverableId: target.item.id,
      deliverableTitle: target.item.title,
      contactName: link.contactName,
      contactEmail: link.contactEmail,
      sentByName: link.sentByName,
      sentAt: link.createdAt.toISOString(),
      expiresAt: link.expiresAt.toISOString(),
      state: "open",
      decision: null,
      comment: null,
      decidedAt: null,
    },
  };
}

/** Builds the review link's mail when it is sent; a link withdrawn, used, expired or closed meanwhile sends nothing. */
export function reviewLinkMailRenderer(deps: Pick<ReviewDeps, "db" | "appUrl" | "tokens">): MailRenderers {
  return reviewLinkMail.renderer(async ({ linkId }) => {
    const row = await findReviewLinkForPage(deps.db, linkId);
    if (!row) return { skip: "the review link is gone" };
    const state = linkStateOf(row.link, subjectOf(row));
    if (state !== "open") return { skip: `the review link is ${state}` };
    const { link } = row;
    return {
      send: {
        to: link.contactEmail,
        subject: `${row.channelName} asks you to review: ${row.deliverableTitle}`,
        text: [
          `Hello ${link.contactName},`,
          "",
          `${link.sentByName} of ${row.channelName} asks you to review "${row.deliverableTitle}" for ${row.company}'s segment in "${row.episodeTitle}".`,
          "",
          "Open this link to read the script (and watch the cut, if one is attached), then approve it or ask for changes. You don't need an account:",
          reviewUrl(deps.appUrl, deps.tokens.sign(link.id, link.expiresAt)),
          "",
          // The contact has no account, so no zone of their own: UTC, named; the page shows it in their browser's zone.
          `The link is for this one deal, works for one decision, and expires on ${formatInstantNamingZone(link.expiresAt, "UTC")}.`,
        ].join("\n"),
      },
    };
  });
}

/** Withdraws a link not yet used; the item no longer waits on the sponsor. */
export async function revokeLink(db: Database, caller: Caller, dealId: string, linkId: string): Promise<void> {
  const link = await findReviewLinkInDeal(db, caller.channelId, dealId, linkId);
  if (!link) throw notFound("Review link");
  if (link.decidedAt) throw new AppError("conflict", "This link has been used: the sponsor's decision stands. Send a new link for another round.");
  if (link.revokedAt) return;
  await db.transaction(async (tx) => {
    // The item before the link: the order a decision locks them in.
    if (link.deliverableId) await lockDeliverable(tx, link.deliverableId);
    await revokeReviewLink(tx, caller.channelId, dealId, linkId);
    const target = link.deliverableId ? await findDeliverable(tx, caller.channelId, link.deliverableId) : null;
    if (!target) return;
    const backTo = target.item.status === "sent" ? "not_started" : target.item.status;
    if (backTo !== target.item.status) await updateDeliverableRow(tx, caller.channelId, target.item.id, { status: backTo });
    await insertEvents(tx, [
      {
        ...eventBy(caller, target.item.id),
        what: backTo !== target.item.status ? "status" : "note",
        fromStatus: target.item.status,
        toStatus: backTo,
        note: `Review link to ${link.contactName} withdrawn`,
      },
    ]);
  });
}

async function openToken(deps: ReviewDeps, token: string) {
  const claim = deps.tokens.verify(token);
  if (!claim) throw invalidLink();
  const row = await findReviewLinkForPage(deps.db, claim.linkId);
  // The expiry in the token must be the row's: a token re-signed for another expiry is not this link.
  if (!row || Math.floor(row.link.expiresAt.getTime() / 1000) !== Math.floor(claim.expiresAt.getTime() / 1000)) throw invalidLink();
  return row;
}

type LinkRow = NonNullable<Awaited<ReturnType<typeof findReviewLinkForPage>>>;

const subjectOf = (row: LinkRow) => ({ contactId: row.link.contactId, dealState: row.deal.state, itemStatus: row.deliverableStatus });

const closureMessages: Record<ReviewClosure, (row: LinkRow) => string> = {
  contact_removed: () => "This link closed: the channel no longer lists you as the sponsor's contact. Ask them if you still need to review.",
  deal_cancelled: () => "This link closed: the deal was cancelled, so there is nothing left to review.",
  item_removed: () => "This link closed: the item it asked you to review was removed from the deal.",
  item_settled: (row) => `This link closed: the item is already settled (${deliverableStatusLabels[row.deliverableStatus!]}), so there is nothing left to decide.`,
};

/**
 * A fingerprint of what the open page shows the sponsor (the segment, the cut, the item and its
 * status): a decision applies only while it is unchanged. The presigned cut address changes on every
 * read, so the clip and its in and out stand for it.
 */
function seenOf(row: LinkRow): string {
  const { deal } = row;
  const shown = [deal.script, deal.segmentSeconds, deal.talkingPoints, deal.link, deal.promoCode, deal.disclosureText, deal.placement, deal.cutClipId, deal.cutIn, deal.cutOut, row.deliverableTitle, row.deliverableStatus];
  return createHash("sha256").update(JSON.stringify(shown)).digest("base64url").slice(0, 22);
}

/** What the contact sees. A link that can no longer be used shows only that, why, and which channel sent it. */
export async function reviewPage(deps: ReviewDeps, token: string): Promise<ReviewPage> {
  const row = await openToken(deps, token);
  const state = linkStateOf(row.link, subjectOf(row));
  if (state === "decided") {
    return { state, channelName: row.channelName, decision: row.link.decision!, decidedAt: row.link.decidedAt!.toISOString(), contactName: row.link.contactName };
  }
  if (state === "closed") return { state, channelName: row.channelName, reason: closureMessages[closureOf(subjectOf(row))!](row) };
  if (state !== "open") return { state, channelName: row.channelName };
  const deal = row.deal;
  const host = deal.hostId ? await findHost(deps.db, deal.channelId, deal.hostId) : null;
  return {
    state,
    channelName: row.channelName,
    company: row.company,
    contactName: row.link.contactName,
    episodeTitle: row.episodeTitle,
    deliverableTitle: row.deliverableTitle!,
    expiresAt: row.link.expiresAt.toISOString(),
    script: deal.script,
    segmentSeconds: deal.segmentSeconds,
    estimatedSeconds: readSeconds(countWords(deal.script), host?.wordsPerMinute ?? DEFAULT_WORDS_PER_MINUTE),
    talkingPoints: deal.talkingPoints,
    link: deal.link,
    promoCode: deal.promoCode,
    disclosureText: deal.disclosureText,
    placement: deal.placement,
    ...(await cutOfPage(deps, row)),
    pins: (await listLinkPins(deps.db, row.link.id)).map(pinViewOf),
    seen: seenOf(row),
  };
}

/** The cut's address and where its segment runs; no address, no segment (the page then shows the script alone). */
async function cutOfPage(deps: ReviewDeps, row: LinkRow) {
  const clip = await cutClipOf(deps.db, row.deal.channelId, row.deal.cutClipId);
  const cutUrl = clip ? await playUrlOf(deps.storage, clip) : null;
  return { cutUrl, segment: clip && cutUrl ? segmentOf(clip, row.deal) : null };
}

const refusals = {
  decided: "This link has already been used: the decision was recorded. Ask the channel for a new link if something else needs review.",
  expired: "This link has expired. Ask the channel for a new one.",
  revoked: "This link was withdrawn by the channel. Ask them for a new one if you still need to review.",
  open: "This link can't take a decision right now. Reload the page and try again.",
};

/** Why a link takes no decision, in the sponsor's words: 410, and nothing used up. */
function refusal(row: LinkRow): AppError {
  const state = linkStateOf(row.link, subjectOf(row));
  return new AppError("gone", state === "closed" ? closureMessages[closureOf(subjectOf(row))!](row) : refusals[state]);
}

/**
 * The contact approves or asks for changes: once per link, recorded under their name, and mailed to
 * the sender; only while the link is open and the review shows what the contact read (`seen`), else
 * 410 (closed) or 409 with the page as it is now, and nothing changes.
 */
export async function decide(deps: ReviewDeps, token: string, input: z.output<typeof reviewDecisionSchema>): Promise<ReviewPage> {
  const opened = await openToken(deps, token);
  const outcome = await inTransaction(deps.db, async (tx, sql) => {
    const row = await lockReviewSubject(tx, opened.link.id);
    if (!row) throw invalidLink();
    if (linkStateOf(row.link, subjectOf(row)) !== "open") throw refusal(row);
    if (seenOf(row) !== input.seen) return { stale: true } as const;
    const claimed = await claimReviewDecision(tx, row.link.id, input.decision, input.comment);
    if (!claimed) throw refusal(row);
    await updateDeliverableRow(tx, claimed.channelId, row.link.deliverableId!, { status: input.decision });
    await insertEvents(tx, [
      {
        channelId: claimed.channelId,
        deliverableId: row.link.deliverableId!,
        actorId: null,
        actorName: claimed.contactName,
        actorKind: "sponsor",
        what: "review_decision",
        fromStatus: row.deliverableStatus,
        toStatus: input.decision,
        note: input.comment,
      },
    ]);
    if (input.decision === "approved") {
      const sponsor = { channelId: claimed.channelId, actorId: null, actorName: claimed.contactName, actorKind: "sponsor" } as const;
      await approvePairedItems(tx, sponsor, { id: row.link.deliverableId!, title: row.deliverableTitle ?? "the item" });
    }
    await deps.jobs.enqueueMail(decisionMail(deps, row, claimed, input), { db: sql });
    return { decided: claimed, row } as const;
  });
  if ("stale" in outcome) {
    throw new AppError("conflict", "The channel changed this review after you opened it. Read it again below, then decide.", undefined, { page: await reviewPage(deps, token) });
  }
  const { decided, row } = outcome;
  return { state: "decided", channelName: row.channelName, decision: input.decision, decidedAt: decided.decidedAt!.toISOString(), contactName: decided.contactName };
}

type LinkPage = NonNullable<Awaited<ReturnType<typeof findReviewLinkForPage>>>;
type DecidedLink = NonNullable<Awaited<ReturnType<typeof claimReviewDecision>>>;

/**
 * The decision goes to the member who sent the link, if they may still see the item when the mail is
 * sent. A link outlives its sender (it is the channel's request, and the sponsor did nothing wrong), so
 * when the sender has left or lost the role, the channel's current owners and producers get it instead.
 */
function decisionMail(deps: ReviewDeps, row: LinkPage, decided: DecidedLink, input: z.output<typeof reviewDecisionSchema>) {
  // The contact's comment is theirs: quoted, line by line, and bounded by the schema (2,000 characters).
  const quoted = input.comment ? `Their comment:\n${input.comment.split(/\r?\n/).map((line) => `> ${line}`).join("\n")}` : "No comment was left.";
  return memberMail({
    channelId: decided.channelId,
    userId: decided.sentBy,
    topic: "decisions",
    needs: { area: "deliverables", need: "R" },
    otherwise: { area: "deliverables", need: "W", note: `You get this because ${decided.sentByName}, who sent the review link, is no longer in the channel.` },
    subject: `${decided.contactName} of ${row.company} ${decisionWords[input.decision]} "${row.deliverableTitle}"`,
    text: [
      `${decided.contactName} (${decided.contactEmail}) ${decisionWords[input.decision]} "${row.deliverableTitle}" for "${row.episodeTitle}" on ${momentFor(decided.decidedAt!)}.`,
      "",
      quoted,
      "",
      `The item is now "${deliverableStatusLabels[input.decision]}". Open the episode's sponsor deals in Kerf:`,
      `${deps.appUrl}/c/${decided.channelId}/episodes/${row.deal.episodeId}/sponsor-deals`,
    ].join("\n"),
  });
}

const tooManyPins = () => new AppError("rate_limited", `This link has taken many comments; a link takes at most ${PINS_PER_LINK}, and ${PINS_PER_MINUTE} a minute. Wait a minute, or put the rest in your decision's comment.`);

/**
 * The contact pins a comment to a moment of the segment: only while the link is open (410 otherwise,
 * like a decision), at a moment inside the segment, and a bounded number per link and per minute.
 */
export async function addPin(deps: ReviewDeps, token: string, input: z.output<typeof reviewPinSchema>): Promise<ReviewPinView> {
  const opened = await openToken(deps, token);
  return deps.db.transaction(async (tx) => {
    const row = await lockReviewSubject(tx, opened.link.id);
    if (!row) throw invalidLink();
    if (linkStateOf(row.link, subjectOf(row)) !== "open") throw refusal(row);
    const clip = await cutClipOf(tx, row.deal.channelId, row.deal.cutClipId);
    const segment = clip ? segmentOf(clip, row.deal) : null;
    if (!segment) throw new AppError("validation_failed", "Some fields need attention.", { atSeconds: "There is no cut to pin a comment to: leave it in your decision's comment." });
    const length = segment.endSeconds - segment.startSeconds;
    if (input.atSeconds > length + 0.001) throw new AppError("validation_failed", "Some fields need attention.", { atSeconds: "That moment is past the segment's end." });
    const counted = await countLinkPins(tx, row.link.id, new Date(Date.now() - 60_000));
    if (counted.all >= PINS_PER_LINK || counted.recent >= PINS_PER_MINUTE) throw tooManyPins();
    const pin = await insertReviewPin(tx, {
      channelId: row.link.channelId,
      dealId: row.link.dealId,
      linkId: row.link.id,
      deliverableId: row.link.deliverableId,
      offsetMs: Math.round(Math.min(input.atSeconds, length) * 1000),
      note: input.note,
      contactName: row.link.contactName,
    });
    return pinViewOf(pin);
  });
}

/** The deal's cut as a member's player gets it: a short-lived address and where the segment runs; nulls without a cut. */
export async function cutPlayer(deps: ReviewDeps, caller: Caller, dealId: string): Promise<{ url: string | null; segment: ReviewSegment | null }> {
  const deal = await findDeal(deps.db, caller.channelId, dealId);
  if (!deal) throw notFound("Deal");
  const clip = await cutClipOf(deps.db, caller.channelId, deal.deal.cutClipId);
  if (!clip) return { url: null, segment: null };
  const url = await playUrlOf(deps.storage, clip);
  return { url, segment: url ? segmentOf(clip, deal.deal) : null };
}
