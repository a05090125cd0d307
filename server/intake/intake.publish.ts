import { sql } from "drizzle-orm";
import type { Queryable } from "../db/client";
import { intakeContacts, intakeIdeas, intakeNews, intakeSuggestions } from "../db/schema/intake";
import { sqlExecutorOf } from "../db/transaction";
import type { Jobs } from "../jobs/queue";
import { channelShare } from "../mail/mail-jobs";
import type { GoLiveFollower } from "../seams/publish-sources";
import { newsMail } from "./intake.mail";

/**
 * The video of a promoted idea went live: each confirmed viewer who asked for news gets one mail with
 * its link. intake_news's key (episode, viewer) makes a second go-live of the same episode mail nobody again.
 */
export function intakeFollowsGoLive(jobs: Pick<Jobs, "enqueueMail">): GoLiveFollower {
  return {
    name: "intake.news",
    async follow(db: Queryable, change) {
      const added = await db.execute<{ contact_id: string }>(sql`
        insert into ${intakeNews} (episode_id, contact_id, channel_id, video_url)
        select distinct ${change.episodeId}::uuid, c.id, ${change.channelId}::uuid, ${change.videoUrl}
        from ${intakeIdeas} i
        join ${intakeSuggestions} s on s.idea_id = i.id
        join ${intakeContacts} c on c.id = s.contact_id
        where i.episode_id = ${change.episodeId} and i.channel_id = ${change.channelId}
          and c.confirmed_at is not null and c.unsubscribed_at is null
        on conflict do nothing
        returning contact_id`);
      const executor = sqlExecutorOf(db);
      for (const row of added.rows) {
        await jobs.enqueueMail(newsMail.job({ contactId: row.contact_id, episodeId: change.episodeId }, channelShare(change.channelId)), { db: executor });
      }
      return added.rows.length;
    },
  };
}
