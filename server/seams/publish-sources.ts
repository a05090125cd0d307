import type { Credit, PaidMention, PartUsed } from "../../shared/publish/description";
import type { MarkSpan } from "../../shared/publish/markers";
import type { Queryable } from "../db/client";

/**
 * The publish-package seam. The package is drafted from what other features hold (a deal's disclosure,
 * link and code; the parts the bench measured) and checked against what they still wait for (sponsor
 * approvals); going live starts their "after go-live" dates. Each such feature exports a
 * `PublishSource` or a `GoLiveFollower`; server/app.ts lists them. Nothing here knows any feature.
 */
export interface PublishFacts {
  mentions: PaidMention[];
  parts: PartUsed[];
  credits: Credit[];
  /** Approvals still open that the video should not go out without, each in plain words. */
  openApprovals: string[];
  /** The footage's marks in the order its edit decision list lays them: chapters can be taken from them. */
  marks: MarkSpan[];
  /** Days after go-live on which a deal asks for the video's figures. */
  figureDays: number[];
}

export interface EpisodeRef {
  channelId: string;
  episodeId: string;
}

export interface PublishSource {
  name: string;
  read(db: Queryable, episode: EpisodeRef): Promise<Partial<PublishFacts>>;
}

/** Called inside the go-live transaction: a follower that fails undoes the go-live. */
export interface GoLiveFollower {
  name: string;
  /** `videoUrl`: where the video can be watched, as the go-live gave it. */
  follow(db: Queryable, change: EpisodeRef & { actorId: string; liveOn: string; videoUrl: string }): Promise<unknown>;
}

export async function readPublishFacts(sources: readonly PublishSource[], db: Queryable, episode: EpisodeRef): Promise<PublishFacts> {
  const parts = await Promise.all(sources.map((source) => source.read(db, episode)));
  return {
    mentions: parts.flatMap((p) => p.mentions ?? []),
    parts: parts.flatMap((p) => p.parts ?? []),
    credits: parts.flatMap((p) => p.credits ?? []),
    openApprovals: parts.flatMap((p) => p.openApprovals ?? []),
    marks: parts.flatMap((p) => p.marks ?? []),
    figureDays: [...new Set(parts.flatMap((p) => p.figureDays ?? []))].sort((a, b) => a - b),
  };
}
