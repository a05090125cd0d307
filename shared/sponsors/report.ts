import { z } from "zod";
import type { FigureValues } from "../publish/figures";
import type { DeliverableKind, DeliverableStatus } from "./deliverables";
import type { Placement } from "./schemas";

/** What the sponsor's report shows, the same on the members' page, the signed-out page and the PDF. */
export interface SponsorReportView {
  channelName: string;
  company: string;
  episodeTitle: string | null;
  videoUrl: string | null;
  publishedAt: string | null;
  liveOn: string | null;
  deliverables: { title: string; kind: DeliverableKind; dueDate: string | null; status: DeliverableStatus }[];
  segment: { placement: Placement; contractedSeconds: number; measuredSeconds: number | null; estimatedSeconds: number };
  talkingPoints: { point: string; covered: boolean }[];
  link: string | null;
  code: string | null;
  disclosure: { wording: string | null; asPublished: string | null };
  figures: { day: number; dueOn: string | null; values: FigureValues }[];
  /** Only for members who see fees (owner, producer); never on the sponsor's page or the PDF. */
  money?: { fee: number; currency: string };
}

export interface ReportFileView {
  state: "queued" | "ready" | "failed";
  failure: string | null;
  pages: number | null;
  sizeBytes: number | null;
  madeAt: string | null;
  sentTo: string | null;
  sentAt: string | null;
  linkExpiresAt: string | null;
  /** A presigned address of the PDF (an hour), when it is made. */
  pdfUrl: string | null;
}

export const sendReportSchema = z.strictObject({
  expiresInDays: z.number().int().min(1, "Keep the link open at least a day.").max(90, "A link stays open at most 90 days.").default(30),
});

/**
 * The disclosure as the video carries it: the published description's line that holds the deal's
 * wording (compared without case or spacing differences), or null when the description doesn't.
 */
export function disclosureAsPublished(description: string, wording: string | null): string | null {
  if (!wording?.trim()) return null;
  const squeeze = (text: string) => text.toLowerCase().replace(/\s+/g, " ").trim();
  const wanted = squeeze(wording);
  return description.split(/\r?\n/).find((line) => squeeze(line).includes(wanted))?.trim() ?? null;
}

/** The page count of a PDF Chromium wrote: its page tree's count (PDF 32000-1:2008, 7.7.3.2 "Page Tree Nodes"). */
export function pdfPageCount(pdf: string): number | null {
  const counts = [...pdf.matchAll(/\/Type\s*\/Pages\b[^>]*?\/Count\s+(\d+)|\/Count\s+(\d+)[^>]*?\/Type\s*\/Pages\b/g)].map((m) => Number(m[1] ?? m[2]));
  return counts.length > 0 ? Math.max(...counts) : null;
}
