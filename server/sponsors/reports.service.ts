import { addDays } from "date-fns";
import { formatInstantNamingZone } from "../../shared/fields/written-dates";
import { isMoneyKind, isSettled } from "../../shared/sponsors/deliverables";
import { disclosureAsPublished, type ReportFileView, type SponsorReportView } from "../../shared/sponsors/report";
import type { DealView } from "../../shared/sponsors/schemas";
import type { Database, Queryable } from "../db/client";
import { inTransaction } from "../db/transaction";
import { AppError } from "../http/app-error";
import type { Caller } from "../http/route-table";
import type { Jobs } from "../jobs/queue";
import { channelShare, mailKind, type MailRenderers } from "../mail/mail-jobs";
import { takeMailQuota } from "../mail/quotas";
import { requireConfirmedAddress } from "../mail/senders";
import type { PublishedVideoReader } from "../seams/published-video";
import { type Storage, viaStorage } from "../storage/storage";
import { insertEvents, updateDeliverableRow } from "./deals.repository";
import { dealView, eventBy } from "./deals.service";
import type { ReviewTokens } from "./review-token";
import * as repo from "./reports.repository";

export const SPONSOR_REPORT_QUEUE = "sponsors-report-pdf";
/** Where pg-boss puts a copy of a PDF job it gave up on: its last run failed, or both runs never finished. */
export const SPONSOR_REPORT_GIVEN_UP_QUEUE = "sponsors-report-pdf-given-up";

export interface ReportContext {
  db: Database;
  storage: Storage;
  jobs: Pick<Jobs, "enqueue" | "enqueueMail">;
  published: PublishedVideoReader;
  appUrl: string;
  /** The link mailed to the sponsor, and the short one the PDF job opens the page with. */
  tokens: { link: ReviewTokens; print: ReviewTokens };
}

const PDF_URL_SECONDS = 3600;
export const reportUrl = (appUrl: string, token: string) => `${appUrl}/sponsor-report/${token}`;

/** Who reads the deal for a report that leaves the channel: a role without fees, so money never comes with it. */
const outsideReader = (channelId: string): Caller => ({ userId: "00000000-0000-0000-0000-000000000000", name: "", email: "", emailVerified: false, timeZone: "UTC", channelId, role: "editor" });

function reportOf(deal: DealView, channelName: string, video: Awaited<ReturnType<PublishedVideoReader["read"]>>): SponsorReportView {
  return {
    channelName,
    company: deal.sponsor.company,
    episodeTitle: deal.episodeTitle,
    videoUrl: video.videoUrl,
    publishedAt: video.publishedAt,
    liveOn: video.liveOn,
    deliverables: deal.deliverables.filter((d) => !isMoneyKind(d.kind)).map((d) => ({ title: d.title, kind: d.kind, dueDate: d.dueDate, status: d.status })),
    segment: { placement: deal.placement, contractedSeconds: deal.segmentSeconds, measuredSeconds: deal.cut.timing?.measuredSeconds ?? null, estimatedSeconds: deal.read.estimatedSeconds },
    talkingPoints: deal.read.points.map((p) => ({ point: p.point, covered: p.covered !== null })),
    link: deal.link,
    code: deal.promoCode,
    disclosure: { wording: deal.disclosureText, asPublished: disclosureAsPublished(video.description, deal.disclosureText) },
    figures: video.figures,
  };
}

async function buildReport(ctx: ReportContext, db: Queryable, caller: Caller, dealId: string): Promise<SponsorReportView> {
  const deal = await dealView(db, caller, dealId);
  if (!deal.episodeId) throw new AppError("conflict", "Tie this deal to its episode first: the report is about the episode's video.");
  const [video, name] = await Promise.all([ctx.published.read(db, { channelId: caller.channelId, episodeId: deal.episodeId }), repo.channelName(db, caller.channelId)]);
  const report = reportOf(deal, name, video);
  if (deal.money) report.money = { fee: deal.money.fee, currency: deal.money.currency };
  return report;
}

async function fileView(ctx: Pick<ReportContext, "storage">, row: repo.ReportRow | null): Promise<ReportFileView | null> {
  if (!row) return null;
  const pdfUrl = row.state === "ready" && row.objectKey ? await viaStorage(() => ctx.storage.presignGet(row.objectKey!, { expiresInSeconds: PDF_URL_SECONDS, fileName: "sponsor-report.pdf", contentType: "application/pdf" })) : null;
  const iso = (d: Date | null) => d?.toISOString() ?? null;
  return { state: row.state, failure: row.failure, pages: row.pages, sizeBytes: row.sizeBytes, madeAt: iso(row.madeAt), sentTo: row.sentTo, sentAt: iso(row.sentAt), linkExpiresAt: iso(row.linkExpiresAt), pdfUrl };
}

/** The members' report: the same as the sponsor's, with the fee for those who see fees. */
export async function memberReport(ctx: ReportContext, caller: Caller, dealId: string) {
  const report = await buildReport(ctx, ctx.db, caller, dealId);
  return { report, file: await fileView(ctx, await repo.findReport(ctx.db, caller.channelId, dealId)) };
}

/** Queues the PDF; the answer says "queued" at once and the job does the rest. */
export async function requestPdf(ctx: ReportContext, caller: Caller, dealId: string) {
  return inTransaction(ctx.db, async (tx, sql) => {
    await buildReport(ctx, tx, caller, dealId);
    const row = await repo.queueReport(tx, caller.channelId, dealId, caller.userId);
    await ctx.jobs.enqueue(SPONSOR_REPORT_QUEUE, { channelId: caller.channelId, reportId: row.id }, { retryLimit: 1, expireInSeconds: 120, deadLetter: SPONSOR_REPORT_GIVEN_UP_QUEUE, db: sql });
    return { file: await fileView(ctx, row) };
  });
}

const reportMail = mailKind<{ reportId: string }>("sponsor-report");

/** Mails the sponsor's contact a signed link to the report; the deal's report items are done with it. */
export async function sendReport(ctx: ReportContext, caller: Caller, dealId: string, input: { expiresInDays: number }) {
  requireConfirmedAddress(caller);
  const deal = await dealView(ctx.db, caller, dealId);
  if (!deal.contact) throw new AppError("conflict", "Choose the sponsor's contact on the deal first: the report is mailed to them.");
  const row = await repo.findReport(ctx.db, caller.channelId, dealId);
  if (row?.state !== "ready") throw new AppError("conflict", "Make the PDF first: the mail links to the report and its PDF.");
  const expiresAt = new Date(Math.floor(addDays(new Date(), input.expiresInDays).getTime() / 1000) * 1000);
  const contact = deal.contact;
  await inTransaction(ctx.db, async (tx, sql) => {
    await takeMailQuota(tx, "sponsor_report", caller);
    await repo.markReportSent(tx, row.id, { sentTo: contact.email, sentAt: new Date(), linkExpiresAt: expiresAt });
    const open = (await repo.reportItems(tx, caller.channelId, dealId)).filter((item) => !isSettled(item.status));
    for (const item of open) await updateDeliverableRow(tx, caller.channelId, item.id, { status: "done" });
    await insertEvents(tx, open.map((item) => ({ ...eventBy(caller, item.id), what: "status" as const, fromStatus: item.status, toStatus: "done" as const, note: `Report sent to ${contact.name} <${contact.email}>` })));
    await ctx.jobs.enqueueMail(reportMail.job({ reportId: row.id }, channelShare(caller.channelId)), { db: sql });
  });
  return { file: await fileView(ctx, await repo.findReport(ctx.db, caller.channelId, dealId)), url: reportUrl(ctx.appUrl, ctx.tokens.link.sign(row.id, expiresAt)) };
}

const invalidLink = () => new AppError("not_found", "This report link is not valid. Check that the whole address was copied, or ask the channel for a new one.");
/** A link Kerf made that no longer opens: 410, and why, in the sponsor's words. */
const goneLink = (why: string) => new AppError("gone", `${why} Ask the channel for a new link.`);

/** The sponsor's page, opened with the mailed link (or by the PDF job with its own short-lived one). */
export async function reportForLink(ctx: ReportContext, token: string, now = new Date()) {
  const mailed = ctx.tokens.link.verify(token);
  const printing = mailed ? null : ctx.tokens.print.verify(token);
  const signed = mailed ?? printing;
  if (!signed) throw invalidLink();
  if (signed.expiresAt.getTime() <= now.getTime()) throw goneLink("This report link has expired.");
  const row = await repo.findReportById(ctx.db, signed.linkId);
  if (!row) throw goneLink("This report is no longer shared.");
  // A mailed link works while it is the one last sent: sending again retires the one before.
  if (mailed && row.linkExpiresAt?.getTime() !== mailed.expiresAt.getTime()) throw goneLink("A newer link to this report was sent; this one no longer opens it.");
  const report = await buildReport(ctx, ctx.db, outsideReader(row.channelId), row.dealId);
  const file = mailed ? await fileView(ctx, row) : null;
  return { report, pdfUrl: file?.pdfUrl ?? null, expiresAt: signed.expiresAt.toISOString() };
}

/** Builds the report's mail when it is sent: Kerf's own words and the names involved, the link made now. */
export function reportMailRenderer(ctx: Pick<ReportContext, "db" | "appUrl" | "tokens">): MailRenderers {
  return reportMail.renderer(async ({ reportId }) => {
    const row = await repo.findReportById(ctx.db, reportId);
    if (!row?.sentTo || !row.linkExpiresAt) return { skip: "the report is gone or was not sent" };
    const deal = await dealView(ctx.db, outsideReader(row.channelId), row.dealId).catch(() => null);
    if (!deal) return { skip: "the deal is gone" };
    const name = await repo.channelName(ctx.db, row.channelId);
    return {
      send: {
        to: row.sentTo,
        subject: `${name}: the report on ${deal.sponsor.company}'s segment in "${deal.episodeTitle ?? "the video"}"`,
        text: [
          "Hello,",
          "",
          `${name} sends you the report on ${deal.sponsor.company}'s segment in "${deal.episodeTitle ?? "the video"}": the deliverables and their dates, the segment, the disclosure as published, and the video's figures, with a PDF to keep. You don't need an account:`,
          reportUrl(ctx.appUrl, ctx.tokens.link.sign(row.id, row.linkExpiresAt)),
          "",
          `The link is for this one report and expires on ${formatInstantNamingZone(row.linkExpiresAt, "UTC")}.`,
        ].join("\n"),
      },
    };
  });
}
