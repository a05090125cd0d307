import { EpisodePage } from "../features/slate/components/EpisodePage";
import { ShownFootage } from "../features/rushes/components/ShownFootage";
import { FootageShownSlot, type FootageShownProps } from "../lib/footage-shown";
import { episodeSections } from "./episode-sections";

const shownFootage = (props: FootageShownProps) => <ShownFootage {...props} />;

/** The episode page with every feature's section: one download when an episode is first opened. */
export function EpisodePageWithSections() {
  return (
    // A run's or an iteration's card lists the footage that shows it: the rushes part fills the bench's slot.
    <FootageShownSlot filler={shownFootage}>
      <EpisodePage sections={episodeSections} />
    </FootageShownSlot>
  );
}
