import { and, eq } from "drizzle-orm";
import { channels } from "../db/schema/accounts";
import { deliverables, sponsorReports } from "../db/schema/sponsors";
import type { Db } from "./deals.repository";

export type ReportRow = typeof sponsorReports.$inferSelect;

export async function findReport(db: Db, channelId: string, dealId: string) {
  const [row] = await db.select().from(sponsorReports).where(and(eq(sponsorReports.channelId, channelId), eq(sponsorReports.dealId, dealId)));
  return row ?? null;
}

/** A report named by a signed link: the token, not a channel, scopes it. */
export async function findReportById(db: Db, reportId: string) {
  const [row] = await db.select().from(sponsorReports).where(eq(sponsorReports.id, reportId));
  return row ?? null;
}

/** The deal's report waits for its PDF (again); its last sending is kept. */
export async function queueReport(db: Db, channelId: string, dealId: string, requestedBy: string) {
  const values = { state: "queued" as const, failure: null, requestedBy, updatedAt: new Date() };
  const [row] = await db
    .insert(sponsorReports)
    .values({ channelId, dealId, ...values })
    .onConflictDoUpdate({ target: sponsorReports.dealId, set: values })
    .returning();
  return row!;
}

/** The report's state, its row held until the transaction ends; null when it is gone. */
export async function lockReportState(db: Db, channelId: string, reportId: string): Promise<ReportRow["state"] | null> {
  const [row] = await db
    .select({ state: sponsorReports.state })
    .from(sponsorReports)
    .where(and(eq(sponsorReports.id, reportId), eq(sponsorReports.channelId, channelId)))
    .for("update");
  return row?.state ?? null;
}

export async function finishReport(db: Db, reportId: string, values: Partial<Pick<ReportRow, "state" | "objectKey" | "pages" | "sizeBytes" | "failure" | "madeAt">>) {
  await db.update(sponsorReports).set({ ...values, updatedAt: new Date() }).where(eq(sponsorReports.id, reportId));
}

export async function markReportSent(db: Db, reportId: string, values: { sentTo: string; sentAt: Date; linkExpiresAt: Date }) {
  await db.update(sponsorReports).set({ ...values, updatedAt: new Date() }).where(eq(sponsorReports.id, reportId));
}

export async function reportItems(db: Db, channelId: string, dealId: string) {
  return db
    .select({ id: deliverables.id, status: deliverables.status })
    .from(deliverables)
    .where(and(eq(deliverables.channelId, channelId), eq(deliverables.dealId, dealId), eq(deliverables.kind, "report")));
}

export async function channelName(db: Db, channelId: string): Promise<string> {
  const [row] = await db.select({ name: channels.name }).from(channels).where(eq(channels.id, channelId));
  return row?.name ?? "";
}
