import type { EpisodeSection } from "../lib/episode-sections";

/**
 * The sections features add to the episode page, in the order of the episode's path. The slate's
 * own sections (overview, schedule, history) come first; each feature adds one line here.
 */
export const episodeSections: EpisodeSection[] = [];
