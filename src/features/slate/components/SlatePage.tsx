import { Link } from "react-router-dom";
import { stageLabels, stages } from "@shared/slate/stages";
import type { EpisodeSummary } from "@shared/slate/schemas";
import { PageHeader } from "../../../components/PageHeader";
import { Empty, LoadError, Loading } from "../../../components/States";
import { useCurrentChannel } from "../../../lib/session";
import { useEpisodes } from "../api/list-episodes";

/** Every live episode of the channel, one lane per stage. */
export function SlatePage() {
  const channel = useCurrentChannel();
  if (!channel) return <Loading />;
  return <Slate channelId={channel.channelId} channelName={channel.channelName} />;
}

function Slate({ channelId, channelName }: { channelId: string; channelName: string }) {
  const episodes = useEpisodes(channelId);
  return (
    <div>
      <PageHeader title="Slate" subtitle={`${channelName}: every episode from challenge to publish.`} />
      {episodes.isPending && <Loading label="Loading the slate…" />}
      {episodes.isError && <LoadError error={episodes.error} retry={() => void episodes.refetch()} />}
      {episodes.data && episodes.data.length === 0 && <Empty title="No episodes yet">A challenge becomes an episode here.</Empty>}
      {episodes.data && episodes.data.length > 0 && (
        <div className="flex gap-3 overflow-x-auto pb-4">
          {stages.map((stage, index) => {
            const inStage = episodes.data.filter((e) => e.stage === stage && !e.archivedAt);
            return (
              <section key={stage} aria-labelledby={`lane-${stage}`} className="flex w-64 shrink-0 flex-col rounded-lg bg-ply-200/70 p-2">
                <h2 id={`lane-${stage}`} className="flex items-baseline justify-between px-2 py-1 text-sm font-semibold text-graphite-700">
                  <span>
                    <span className="mr-1 text-graphite-500">{index + 1}</span> {stageLabels[stage]}
                  </span>
                  <span className="text-xs text-graphite-500">{inStage.length}</span>
                </h2>
                <ul className="flex flex-col gap-2">
                  {inStage.map((episode) => (
                    <EpisodeTile key={episode.id} channelId={channelId} episode={episode} />
                  ))}
                </ul>
              </section>
            );
          })}
        </div>
      )}
    </div>
  );
}

function EpisodeTile({ channelId, episode }: { channelId: string; episode: EpisodeSummary }) {
  return (
    <li>
      <Link to={`/c/${channelId}/episodes/${episode.id}`} className="block rounded-md border-l-4 border-amber-cut bg-white p-3 shadow-sm hover:shadow">
        <p className="font-semibold leading-snug">{episode.title}</p>
        <p className="mt-1 line-clamp-2 text-xs text-graphite-500">{episode.question}</p>
        <p className="mt-2 flex justify-between text-xs text-graphite-700">
          <span>{episode.ownerName ?? "No owner"}</span>
          {episode.targetPublishDate && <span>{episode.targetPublishDate}</span>}
        </p>
      </Link>
    </li>
  );
}
