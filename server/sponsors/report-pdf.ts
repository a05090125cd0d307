import { randomUUID } from "node:crypto";
import { Readable } from "node:stream";
import type PgBoss from "pg-boss";
import { pdfPageCount } from "../../shared/sponsors/report";
import { sharedBrowser } from "../jobs/chromium";
import { type LeftAlone, settleGivenUp } from "../jobs/given-up";
import type { Jobs } from "../jobs/queue";
import * as repo from "./reports.repository";
import { type ReportContext, reportUrl, SPONSOR_REPORT_GIVEN_UP_QUEUE, SPONSOR_REPORT_QUEUE } from "./reports.service";
import { makeQueue } from "../jobs/make-queue";

/** The page the PDF is printed from may take this long to load and draw its charts. */
const PAGE_MS = 30_000;
const PRINT_TOKEN_MS = 5 * 60_000;
/** Chromium prints the footer as a page of its own, without the app's fonts or styles: it states its own. */
const FOOTER = `<div style="width:100%;margin:0 12mm;font:8px sans-serif;color:#5b6567;text-align:right">Page <span class="pageNumber"></span> of <span class="totalPages"></span></div>`;

export interface ReportJob {
  channelId: string;
  reportId: string;
  [key: string]: unknown;
}

/**
 * The report's own page (the sponsor's, opened with a short-lived print link) printed to A4 by
 * Chromium: the same React page and chart components the sponsor sees. In a job only.
 */
async function printReport(ctx: ReportContext & { chromiumPath: string }, reportId: string): Promise<Buffer> {
  const token = ctx.tokens.print.sign(reportId, new Date(Math.floor((Date.now() + PRINT_TOKEN_MS) / 1000) * 1000));
  const context = await (await sharedBrowser(ctx.chromiumPath)).newContext({ viewport: { width: 1000, height: 1400 } });
  try {
    const page = await context.newPage();
    await page.goto(`${reportUrl(ctx.appUrl, token)}?print=1`, { waitUntil: "load", timeout: PAGE_MS });
    await page.waitForSelector("[data-report-ready]", { timeout: PAGE_MS });
    // Every chart drawn: each figures chart holds its library's drawing surface.
    await page.waitForFunction(() => [...document.querySelectorAll("[data-figure-chart]")].every((c) => c.querySelector("svg.recharts-surface")), undefined, { timeout: PAGE_MS });
    await page.evaluate(() => document.fonts.ready.then(() => undefined));
    return await page.pdf({
      format: "A4",
      printBackground: true,
      displayHeaderFooter: true,
      headerTemplate: "<span></span>",
      footerTemplate: FOOTER,
      margin: { top: "14mm", bottom: "16mm", left: "12mm", right: "12mm" },
    });
  } finally {
    await context.close();
  }
}

export async function makeReportPdf(ctx: ReportContext & { chromiumPath: string }, job: ReportJob) {
  const row = await repo.findReportById(ctx.db, job.reportId);
  if (!row || row.channelId !== job.channelId || row.state !== "queued") return { outcome: "skipped" };
  try {
    const pdf = await printReport(ctx, row.id);
    const objectKey = `${row.channelId}/reports/${randomUUID()}.pdf`;
    await ctx.storage.putStream(objectKey, Readable.from([pdf]), { contentType: "application/pdf", size: pdf.length });
    const pages = pdfPageCount(pdf.toString("latin1"));
    await repo.finishReport(ctx.db, row.id, { state: "ready", objectKey, pages, sizeBytes: pdf.length, failure: null, madeAt: new Date() });
    if (row.objectKey) await ctx.storage.remove(row.objectKey).catch(() => undefined);
    return { outcome: "made", pages, bytes: pdf.length };
  } catch (error) {
    console.error(`[sponsors] report PDF ${row.id} failed: ${(error as Error).message}`);
    await repo.finishReport(ctx.db, row.id, { state: "failed", failure: "Making the PDF failed on the server; try again, and tell whoever runs Kerf if it happens again." });
    throw error;
  }
}

type ReportWorkerContext = ReportContext & { chromiumPath: string; jobs: Pick<Jobs, "countLive"> };

const STOPPED_REASON = "The server stopped twice before it finished the PDF; make it again, and tell whoever runs Kerf if it happens again.";

/**
 * A PDF job pg-boss gave up on. A run that failed has already failed the report; two that never
 * finished (the server stopped during each) left it queued, so it fails now, saying so, unless a new
 * request has queued a job of its own since. The report's row is held while this looks.
 */
export function settleGivenUpReport(ctx: Pick<ReportContext, "db"> & { jobs: Pick<Jobs, "countLive"> }, job: ReportJob): Promise<{ outcome: "failed" } | LeftAlone> {
  return settleGivenUp(ctx.db, ctx.jobs, {
    noun: "report",
    queue: SPONSOR_REPORT_QUEUE,
    key: "reportId",
    value: job.reportId,
    lock: (tx) => repo.lockReportState(tx, job.channelId, job.reportId),
    unfinished: ["queued"],
    settle: async (tx) => {
      await repo.finishReport(tx, job.reportId, { state: "failed", failure: STOPPED_REASON });
      return { outcome: "failed" as const };
    },
  });
}

/**
 * This instance's report worker: one PDF at a time, each channel's n-th waiting report before any
 * channel's (n+1)-th; and the settling of jobs pg-boss gave up on (`settleGivenUpReport`).
 */
export async function startSponsorReportWorker(boss: PgBoss, ctx: ReportWorkerContext, options: { pollSeconds?: number } = {}): Promise<void> {
  const polling = { batchSize: 1, pollingIntervalSeconds: options.pollSeconds ?? 2 };
  await makeQueue(boss, SPONSOR_REPORT_QUEUE);
  await boss.work<ReportJob>(SPONSOR_REPORT_QUEUE, polling, async ([job]) => makeReportPdf(ctx, job!.data));
  await makeQueue(boss, SPONSOR_REPORT_GIVEN_UP_QUEUE);
  await boss.work<ReportJob>(SPONSOR_REPORT_GIVEN_UP_QUEUE, polling, async ([job]) => settleGivenUpReport(ctx, job!.data));
}
