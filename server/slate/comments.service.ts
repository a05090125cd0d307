import { mentionedIn } from "../../shared/slate/mentions";
import type { EpisodeComment } from "../../shared/slate/schemas";
import { findChannelName } from "../channels/channels.repository";
import type { Database } from "../db/client";
import { notFound } from "../http/app-error";
import type { MemberContext } from "../http/route-table";
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
  if (!(await findEpisode(db, channelId, episodeId))) throw notFound("Episode");
  return withNames(db, channelId, await commentsOf(db, channelId, episodeId));
}

/**
 * A comment, and a mail to each member it mentions (not its author). Mails go through the job queue
 * in PostgreSQL: a mail server that is down delays them and loses none.
 */
export async function addComment(deps: CommentDeps, member: MemberContext, author: { name: string }, episodeId: string, body: string): Promise<EpisodeComment> {
  const { db } = deps;
  const episode = await findEpisode(db, member.channelId, episodeId);
  if (!episode) throw notFound("Episode");
  const people = await peopleOf(db, member.channelId);
  const mentions = mentionedIn(body, people);
  const saved = await insertComment(db, { channelId: member.channelId, episodeId, authorId: member.userId, body, mentions });

  const recipients = await memberAddresses(db, member.channelId, mentions.filter((id) => id !== member.userId));
  const channelName = (await findChannelName(db, member.channelId)) ?? "your channel";
  const link = `${deps.appUrl}/c/${member.channelId}/episodes/${episodeId}#activity`;
  for (const person of recipients) {
    await deps.enqueueMail({
      to: person.email,
      subject: `${author.name} mentioned you on “${episode.title}”`,
      text: `${author.name} mentioned you in a comment on “${episode.title}” (${channelName}):\n\n${body}\n\nOpen the episode: ${link}\n`,
    });
  }
  const names = new Map(people.map((p) => [p.id, p.name]));
  return {
    id: saved.id,
    authorId: member.userId,
    authorName: author.name,
    body,
    mentions: mentions.map((id) => ({ id, name: names.get(id)! })),
    createdAt: saved.createdAt.toISOString(),
  };
}
