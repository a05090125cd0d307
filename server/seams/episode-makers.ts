import type { Database } from "../db/client";
import type { Caller } from "../http/route-table";

/** What a feature hands the slate to open an episode in the challenge stage, from a viewer's ask. */
export interface ViewerEpisode {
  title: string;
  question: string;
  /** A web address the ask can be read at (the viewer's comment, or the idea in Kerf). */
  originLink: string;
  whyWorthIt: string;
}

/**
 * Opens an episode inside the caller's transaction and answers its id. The slate provides it; only
 * server/app.ts wires it to the features that promote things to the slate (the intake).
 */
export type EpisodeMaker = (tx: Database, caller: Caller, episode: ViewerEpisode) => Promise<{ id: string }>;
