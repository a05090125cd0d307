import { EpisodePage } from "../features/slate/components/EpisodePage";
import { episodeSections } from "./episode-sections";

/** The episode page with every feature's section: one download when an episode is first opened. */
export function EpisodePageWithSections() {
  return <EpisodePage sections={episodeSections} />;
}
