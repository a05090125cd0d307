import { mentionedIn } from "../../shared/slate/mentions";
import type { EpisodeComment } from "../../shared/slate/schemas";
import { channelName as channelNameOf } from "../db/channel-scope";
import type { Database } from "../db/client";
import { notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import type { OutgoingMail } from "../mail/mailer";
import { findEpisode } from "./episodes.repository";
import { commentsOf, insertComment, memberAddresses, peopleOf } from "./slate.repository";

export interface CommentDeps {
  db: Database;
  appUrl: string;
  enqueueMail(mail: OutgoingMail): Promise<void>;
}

async function withNames(db: Database, channelId: string, rows: Awaited<ReturnType<typeof commentsOf>>): Promise<EpisodeComment[]> {
  const names = new Map((await peopleOf(db, channelId)).map((p) => [p.id, p.name]));
  return rows.map((row) => ({
    id: row.id,
    authorId: row.authorId,
    authorName: row.authorName,
    body: row.body,
    // A mentioned person who has left the channel keeps the mention, without a name to show.
    mentions: row.mentions.filter((id) => names.has(id)).map((id) => ({ id, name: names.get(id)! })),
    createdAt: row.createdAt.toISOString(),
  }));
}

export async function listComments(db: Database, channelId: string, episodeId: string): Promise<EpisodeComment[]> {
  return withNames(db, channelId, await commentsOf(db, channelId, episodeId));
}

/**
 * A comment, and a mail to each member it mentions (not its author). Mails go through the job queue
 * in PostgreSQL: a mail server that is down delays them and loses none.
 */
export async function addComment(deps: CommentDeps, caller: Caller, episodeId: string, body: string): Promise<EpisodeComment> {
  const { db } = deps;
  const episode = await findEpisode(db, caller.channelId, episodeId);
  if (!episode) throw notFound("Episode");
  const people = await peopleOf(db, caller.channelId);
  const mentions = mentionedIn(body, people);
  const saved = await insertComment(db, { channelId: caller.channelId, episodeId, authorId: caller.userId, body, mentions });

  const recipients = await memberAddresses(db, caller.channelId, mentions.filter((id) => id !== caller.userId));
  const channelName = (await channelNameOf(db, caller.channelId)) ?? "your channel";
  const link = `${deps.appUrl}/c/${caller.channelId}/episodes/${episodeId}#activity`;
  for (const person of recipients) {
    await deps.enqueueMail({
      to: person.email,
      subject: `${caller.name} mentioned you on “${episode.title}”`,
      text: `${caller.name} mentioned you in a comment on “${episode.title}” (${channelName}):\n\n${body}\n\nOpen the episode: ${link}\n`,
    });
  }
  const names = new Map(people.map((p) => [p.id, p.name]));
  return {
    id: saved.id,
    authorId: caller.userId,
    authorName: caller.name,
    body,
    mentions: mentions.map((id) => ({ id, name: names.get(id)! })),
    createdAt: saved.createdAt.toISOString(),
  };
}
