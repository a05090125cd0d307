import { and, asc, eq, inArray, sql, type SQL } from "drizzle-orm";
import type { PgColumn } from "drizzle-orm/pg-core";
import type { Role } from "../../shared/access/roles";
import type { Database } from "./client";
import { channels, invitations, memberships, users } from "./schema/accounts";
import { publishThumbnails } from "./schema/publish";
import { benchParts, benchRuns, buildIterations, buildPhotos, safetyHazards, testCriteria } from "./schema/bench";
import { moneyEntries } from "./schema/economics";
import { clipMarks, clips, shootDays, shots, stills, uploads } from "./schema/rushes";
import { intakeIdeas, intakeSuggestions } from "./schema/intake";
import { episodes } from "./schema/slate";
import { dealInvoices, dealTemplates, deals, deliverables, reviewLinks, sponsorContacts, sponsors } from "./schema/sponsors";

/** Where the row a path parameter names lives, and what to call it when it isn't there. */
interface ChildRow {
  what: string;
  id: PgColumn;
  channelId: PgColumn;
}

const child = (what: string, table: { id: PgColumn; channelId: PgColumn }): ChildRow => ({ what, id: table.id, channelId: table.channelId });

/**
 * Every row of a channel a route's path may name. The route table's guard checks each `:param` of a
 * channel route here before the handler runs: the row must exist in the route's channel, else 404
 * (another channel's ids don't exist for you). A new table a route names gets its line here.
 */
export const channelChildren = {
  episodeId: child("Episode", episodes),
  criterionId: child("Criterion", testCriteria),
  hazardId: child("Hazard", safetyHazards),
  partId: child("Part", benchParts),
  runId: child("Run", benchRuns),
  iterationId: child("Iteration", buildIterations),
  photoId: child("Photo", buildPhotos),
  uploadId: child("Upload", uploads),
  clipId: child("Clip", clips),
  markId: child("Mark", clipMarks),
  stillId: child("Photo", stills),
  shootDayId: child("Shoot day", shootDays),
  shotId: child("Shot", shots),
  sponsorId: child("Sponsor", sponsors),
  contactId: child("Contact", sponsorContacts),
  templateId: child("Template", dealTemplates),
  dealId: child("Deal", deals),
  deliverableId: child("Deliverable", deliverables),
  linkId: child("Review link", reviewLinks),
  thumbnailId: child("Thumbnail", publishThumbnails),
  invoiceId: child("Invoice", dealInvoices),
  entryId: child("Line", moneyEntries),
  invitationId: child("Invitation", invitations),
  ideaId: child("Idea", intakeIdeas),
  suggestionId: child("Suggestion", intakeSuggestions),
  userId: { what: "Member", id: memberships.userId, channelId: memberships.channelId },
} satisfies Record<string, ChildRow>;

export type ChildParam = keyof typeof channelChildren;

export const isChildParam = (name: string): name is ChildParam => Object.hasOwn(channelChildren, name);

export interface ChannelScope {
  /** The caller's role in the channel; null when they are not a member. */
  role: Role | null;
  /** The named rows that are not in the channel, in the order asked. */
  missing: ChildParam[];
}

/**
 * The caller's membership and every named row, in one query: what a channel route's guard needs,
 * at the cost of the membership lookup alone.
 */
export async function channelScope(db: Database, channelId: string, userId: string, rows: { param: ChildParam; id: string }[]): Promise<ChannelScope> {
  const role = sql`(select ${memberships.role} from ${memberships} where ${memberships.channelId} = ${channelId} and ${memberships.userId} = ${userId}) as role`;
  const found: SQL[] = rows.map(({ param, id }, index) => {
    const row = channelChildren[param];
    return sql`exists(select 1 from ${row.id.table} where ${row.id} = ${id} and ${row.channelId} = ${channelId}) as ${sql.identifier(`found_${index}`)}`;
  });
  const result = await db.execute(sql`select ${sql.join([role, ...found], sql`, `)}`);
  const answer = result.rows[0] as Record<string, unknown>;
  return {
    role: (answer.role as Role | null) ?? null,
    missing: rows.filter((_, index) => answer[`found_${index}`] !== true).map((row) => row.param),
  };
}

/** Which of these people belong to the channel: what a field naming members (owner, host, crew) is checked against. */
export async function membersAmong(db: Pick<Database, "select">, channelId: string, userIds: string[]): Promise<string[]> {
  if (userIds.length === 0) return [];
  const rows = await db
    .select({ userId: memberships.userId })
    .from(memberships)
    .where(and(eq(memberships.channelId, channelId), inArray(memberships.userId, userIds)));
  return rows.map((row) => row.userId);
}

export async function isMember(db: Pick<Database, "select">, channelId: string, userId: string): Promise<boolean> {
  return (await membersAmong(db, channelId, [userId])).length > 0;
}

/** The channel's members by name, with their roles and no e-mail addresses: every role may read this. */
export async function channelPeople(db: Pick<Database, "select">, channelId: string) {
  return db
    .select({ userId: users.id, name: users.name, role: memberships.role })
    .from(memberships)
    .innerJoin(users, eq(users.id, memberships.userId))
    .where(eq(memberships.channelId, channelId))
    .orderBy(asc(users.name));
}

export async function channelName(db: Database, channelId: string): Promise<string | null> {
  const [row] = await db.select({ name: channels.name }).from(channels).where(eq(channels.id, channelId));
  return row?.name ?? null;
}
