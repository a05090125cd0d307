import { mentionedIn } from "../../shared/slate/mentions";
import type { EpisodeComment } from "../../shared/slate/schemas";
import { channelName as channelNameOf } from "../db/channel-scope";
import type { Database } from "../db/client";
import { inTransaction } from "../db/transaction";
import { notFound } from "../http/app-error";
import type { Caller } from "../http/route-table";
import type { Jobs } from "../jobs/queue";
import { memberMail } from "../mail/member-mail";
import { takeMailQuota } from "../mail/quotas";
import { findEpisode } from "./episodes.repository";
import { commentsOf, insertComment, peopleOf } from "./slate.repository";

export interface CommentDeps {
  db: Database;
  appUrl: string;
  jobs: Pick<Jobs, "enqueueMail">;
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
 * A comment, and a mail to each member it mentions (not its author), counted against the author's and
 * the channel's mail allowance: the comment, the counts and the queued mails commit together, or a
 * 429 changes nothing. Each mail checks, when it is sent, that its recipient is still a member.
 */
export async function addComment(deps: CommentDeps, caller: Caller, episodeId: string, body: string): Promise<EpisodeComment> {
  const { db } = deps;
  const episode = await findEpisode(db, caller.channelId, episodeId);
  if (!episode) throw notFound("Episode");
  const people = await peopleOf(db, caller.channelId);
  const mentions = mentionedIn(body, people);
  const recipients = mentions.filter((id) => id !== caller.userId);
  const channelName = (await channelNameOf(db, caller.channelId)) ?? "your channel";
  const link = `${deps.appUrl}/c/${caller.channelId}/episodes/${episodeId}#activity`;
  const saved = await inTransaction(db, async (tx, sql) => {
    await takeMailQuota(tx, "mention", caller, recipients.length);
    const row = await insertComment(tx, { channelId: caller.channelId, episodeId, authorId: caller.userId, body, mentions });
    for (const userId of recipients) {
      const mail = memberMail({
        channelId: caller.channelId,
        userId,
        topic: "mentions",
        needs: { area: "comments", need: "R" },
        subject: `${caller.name} mentioned you on “${episode.title}”`,
        text: `${caller.name} mentioned you in a comment on “${episode.title}” (${channelName}):\n\n${body}\n\nOpen the episode: ${link}\n`,
      });
      await deps.jobs.enqueueMail(mail, { db: sql });
    }
    return row;
  });
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
