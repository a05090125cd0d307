import { and, asc, eq, gt, lte, sql } from "drizzle-orm";
import { defaultStageLengths, type StageLengths } from "../../shared/slate/schedule";
import { channelPeople } from "../db/channel-scope";
import type { Database } from "../db/client";
import { users } from "../db/schema/accounts";
import { episodeComments, slateBoardChanges, slateChannels } from "../db/schema/slate";

/** The board's revision and the channel's stage lengths, in one read: what every board load checks first. */
export async function slateStateOf(db: Database, channelId: string): Promise<{ revision: number; stageLengths: StageLengths; custom: boolean }> {
  const [row] = await db
    .select({ revision: slateChannels.boardRevision, stageLengths: slateChannels.stageLengths })
    .from(slateChannels)
    .where(eq(slateChannels.channelId, channelId));
  const stageLengths = row?.stageLengths ? { ...defaultStageLengths, ...row.stageLengths } : defaultStageLengths;
  return { revision: row?.revision ?? 0, stageLengths, custom: Boolean(row?.stageLengths) };
}

/** New lengths change every due date on the board, so the revision goes up with them. */
export async function saveStageLengths(db: Database, channelId: string, stageLengths: StageLengths): Promise<void> {
  await db
    .insert(slateChannels)
    .values({ channelId, stageLengths, boardRevision: 1 })
    .onConflictDoUpdate({
      target: slateChannels.channelId,
      set: { stageLengths, boardRevision: sql`${slateChannels.boardRevision} + 1`, updatedAt: sql`now()` },
    });
}

/** The channel's members as the slate names them: owners to pick, people to mention. */
export async function peopleOf(db: Database, channelId: string): Promise<{ id: string; name: string }[]> {
  return (await channelPeople(db, channelId)).map(({ userId, name }) => ({ id: userId, name }));
}

export async function commentsOf(db: Database, channelId: string, episodeId: string) {
  return db
    .select({
      id: episodeComments.id,
      authorId: episodeComments.authorId,
      authorName: users.name,
      body: episodeComments.body,
      mentions: episodeComments.mentions,
      createdAt: episodeComments.createdAt,
    })
    .from(episodeComments)
    .leftJoin(users, eq(users.id, episodeComments.authorId))
    .where(and(eq(episodeComments.channelId, channelId), eq(episodeComments.episodeId, episodeId)))
    .orderBy(asc(episodeComments.createdAt), asc(episodeComments.id));
}

export async function insertComment(db: Database, values: { channelId: string; episodeId: string; authorId: string; body: string; mentions: string[] }) {
  const [row] = await db.insert(episodeComments).values(values).returning({ id: episodeComments.id, createdAt: episodeComments.createdAt });
  if (!row) throw new Error("comment insert returned nothing");
  return row;
}

/** What revisions after `after` up to `upTo` changed: one row per revision still noted, in order. */
export async function boardChangesBetween(db: Database, channelId: string, after: number, upTo: number): Promise<{ revision: number; episodeId: string | null }[]> {
  return db
    .select({ revision: slateBoardChanges.revision, episodeId: slateBoardChanges.episodeId })
    .from(slateBoardChanges)
    .where(and(eq(slateBoardChanges.channelId, channelId), gt(slateBoardChanges.revision, after), lte(slateBoardChanges.revision, upTo)))
    .orderBy(asc(slateBoardChanges.revision));
}
