import { Link, useParams } from "react-router-dom";
import { stageLabels } from "@shared/slate/stages";
import { PageHeader } from "../../../components/PageHeader";
import { LoadError, Loading } from "../../../components/States";
import { useCurrentChannel } from "../../../lib/session";
import { useEpisode } from "../api/get-episode";
import type { EpisodeSection, EpisodeSectionProps } from "../../../lib/episode-sections";

export function EpisodePage({ sections }: { sections: EpisodeSection[] }) {
  const channel = useCurrentChannel();
  const { episodeId = "" } = useParams();
  if (!channel) return <Loading />;
  return <Episode channelId={channel.channelId} episodeId={episodeId} role={channel.role} sections={sections} />;
}

function Episode({ channelId, episodeId, role, sections }: EpisodeSectionProps & { sections: EpisodeSection[] }) {
  const episode = useEpisode(channelId, episodeId);
  if (episode.isPending) return <Loading label="Loading the episode…" />;
  if (episode.isError) return <LoadError error={episode.error} retry={() => void episode.refetch()} />;
  const e = episode.data;
  return (
    <article className="mx-auto max-w-3xl">
      <Link to={`/c/${channelId}/slate`} className="text-sm text-rust-600 underline">
        ← Slate
      </Link>
      <PageHeader title={e.title} subtitle={e.question} />
      <dl className="grid grid-cols-[10rem_1fr] gap-y-2 rounded-lg border border-ply-300 bg-white p-5 text-sm">
        <dt className="text-graphite-500">Stage</dt>
        <dd className="font-medium">{stageLabels[e.stage]}</dd>
        <dt className="text-graphite-500">Owner</dt>
        <dd>{e.ownerName ?? "No owner yet"}</dd>
        <dt className="text-graphite-500">Target publish date</dt>
        <dd>{e.targetPublishDate ?? "Not set"}</dd>
      </dl>
      {sections.map(({ id, title, Component }) => (
        <section key={id} id={id} aria-labelledby={`${id}-heading`} className="mt-8">
          <h2 id={`${id}-heading`} className="mb-3 text-lg font-semibold">
            {title}
          </h2>
          <Component channelId={channelId} episodeId={episodeId} role={role} />
        </section>
      ))}
    </article>
  );
}
