import { z } from "zod";

/** What a member's feed holds: everything their role may see, or only what is theirs. */
export const feedScopes = ["everything", "mine"] as const;
export type FeedScope = (typeof feedScopes)[number];

export const feedScopeLabels: Record<FeedScope, string> = {
  everything: "Everything I may see",
  mine: "Only what is mine (my episodes, shoot days I'm crew on, items I own)",
};

export const feedRequestSchema = z.strictObject({
  scope: z.enum(feedScopes, { error: "Pick what the feed holds." }),
});

/** A member's feed in one channel as the account page lists it; the address itself is shown once, when made. */
export interface FeedSummary {
  channelId: string;
  channelName: string;
  scope: FeedScope | null;
  createdAt: string | null;
}

export interface NewFeed {
  url: string;
  scope: FeedScope;
}
