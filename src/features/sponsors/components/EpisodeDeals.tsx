import { roleMay } from "@shared/access/roles";
import { FormOpener } from "../../../components/FormOpener";
import { Empty, QueryState } from "../../../components/States";
import type { EpisodeSectionProps } from "../../../lib/episode-sections";
import { useEpisodeDeals } from "../api/episode-deals";
import { DealCard } from "./DealCard";
import { NewDealForm } from "./NewDealForm";

/** The episode page's sponsor section: every deal on this episode. */
export function EpisodeDeals({ channelId, episodeId, role }: EpisodeSectionProps) {
  const deals = useEpisodeDeals(channelId, episodeId);
  const canCreate = roleMay(role, "sponsors", "W");
  if (!roleMay(role, "sponsors", "R")) return null;
  return (
    <div className="flex flex-col gap-4">
      <QueryState
        query={deals}
        loading="Loading the deals…"
        isEmpty={(list) => list.length === 0}
        empty={<Empty title="No sponsor on this episode">{canCreate ? "A deal made here brings its deliverables and their dates." : "Nothing to read yet."}</Empty>}
      >
        {(list) => list.map((deal) => <DealCard key={deal.id} channelId={channelId} deal={deal} role={role} />)}
      </QueryState>
      {canCreate && <FormOpener label="New deal">{(close) => <NewDealForm channelId={channelId} episodeId={episodeId} onDone={close} />}</FormOpener>}
    </div>
  );
}
