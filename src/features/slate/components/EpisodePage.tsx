import { Suspense, useEffect, useRef, type ReactNode } from "react";
import { useQueryClient } from "@tanstack/react-query";
import { Link, Navigate, useLocation, useParams } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import type { EpisodeDetail } from "@shared/slate/schemas";
import { stageLabels } from "@shared/slate/stages";
import { Notice } from "../../../components/Notice";
import { PageHeader } from "../../../components/PageHeader";
import { Loading, QueryState } from "../../../components/States";
import { type EpisodeSection, type EpisodeSectionProps, openPart, partFromFragment } from "../../../lib/episode-sections";
import { useChannel } from "../../../lib/session";
import { useEpisode } from "../api/get-episode";
import { ActivitySection } from "./ActivitySection";
import { EpisodeParts } from "./EpisodeParts";
import { Flag } from "./Flag";
import { HistorySection } from "./HistorySection";
import { OverviewSection } from "./OverviewSection";
import { ScheduleSection } from "./ScheduleSection";

export function EpisodePage({ sections }: { sections: EpisodeSection[] }) {
  const channel = useChannel();
  const { episodeId = "" } = useParams();
  return <Episode channelId={channel.channelId} episodeId={episodeId} role={channel.role} sections={sections} />;
}

/** One episode: the header, then one part at a time (the slate's own and each feature's), chosen in the address. */
function Episode(props: EpisodeSectionProps & { sections: EpisodeSection[] }) {
  const episode = useEpisode(props.channelId, props.episodeId);
  const { part } = useParams();
  // The part the address names (its code and answers) is fetched beside the episode, not after it.
  useOpenPartEarly(props.sections.find((s) => s.id === part), props.channelId, props.episodeId);
  return (
    <QueryState query={episode} loading="Loading the episode…" page back={{ to: `/c/${props.channelId}/slate`, label: "Slate" }}>
      {(detail) => <EpisodeView {...props} detail={detail} />}
    </QueryState>
  );
}

interface Part {
  id: string;
  title: string;
  render: () => ReactNode;
}

function partsOf({ channelId, episodeId, role, sections, detail }: EpisodeSectionProps & { sections: EpisodeSection[]; detail: EpisodeDetail }): Part[] {
  const canEdit = roleMay(role, "episodes", "W");
  return [
    {
      id: "overview",
      title: "Overview and dates",
      render: () => (
        <div className="flex flex-col gap-8">
          <OverviewSection channelId={channelId} detail={detail} canEdit={canEdit} />
          <section id="schedule" aria-labelledby="schedule-heading">
            <h3 id="schedule-heading" className="mb-3 font-semibold">
              Schedule
            </h3>
            <ScheduleSection channelId={channelId} detail={detail} canEdit={canEdit} />
          </section>
        </div>
      ),
    },
    // A part for some roles only (money) is left out for the others: not shown, not reachable by its address.
    ...sections.filter((section) => !section.area || roleMay(role, section.area, "R")).map(({ id, title, Component }) => ({ id, title, render: () => <Component channelId={channelId} episodeId={episodeId} role={role} /> })),
    { id: "history", title: "History", render: () => <HistorySection channelId={channelId} episodeId={episodeId} /> },
    { id: "comments", title: "Comments", render: () => <ActivitySection channelId={channelId} episodeId={episodeId} /> },
  ];
}

function EpisodeView(props: EpisodeSectionProps & { sections: EpisodeSection[]; detail: EpisodeDetail }) {
  const { channelId, episodeId, detail } = props;
  const e = detail.episode;
  const location = useLocation();
  const { part: named } = useParams();
  const parts = partsOf(props);
  const ids = parts.map((p) => p.id);
  const base = `/c/${channelId}/episodes/${episodeId}`;
  const open = openPart(e.stage, named ?? partFromFragment(location.hash, ids), ids);
  const stagePart = openPart(e.stage, undefined, ids);
  const justCreated = (location.state as { created?: boolean } | null)?.created === true;
  const current = parts.find((p) => p.id === open);
  useOpenPartEarly(props.sections.find((s) => s.id === open), channelId, episodeId);

  // An address without a part (or with one the page lacks) is written out, so it always says what is open.
  if (!current || named !== open) return <Navigate to={`${base}/${open}`} replace state={location.state} />;

  return (
    <article>
      <Link to={`/c/${channelId}/slate`} className="text-sm text-rust-600 underline">
        ← Slate
      </Link>
      <PageHeader
        title={e.title}
        subtitle={
          <>
            {e.question && <span className="block">{e.question}</span>}
            <span className="mt-2 flex flex-wrap items-center gap-1">
              <span className="rounded bg-graphite-900 px-2 py-0.5 text-xs font-semibold text-ply-50">{stageLabels[e.stage]}</span>
              {detail.flags.map((flag) => (
                <Flag key={flag.code} flag={flag} />
              ))}
            </span>
          </>
        }
      />
      {justCreated && (
        <div className="mb-3">
          <Notice kind="success">“{e.title}” is on the board, at the top of Challenge.</Notice>
        </div>
      )}
      <div className="grid grid-cols-[minmax(0,1fr)] gap-4 lg:grid-cols-[13rem_minmax(0,1fr)] lg:gap-8">
        <EpisodeParts base={base} parts={parts} open={open} stagePart={stagePart} stageLabel={stageLabels[e.stage]} />
        <PartView key={current.id} part={current} />
      </div>
    </article>
  );
}

/**
 * The open part's code and its first answers, both asked for as soon as the episode says which part
 * opens: the code no longer waits for the redirect to the part's address, nor the answers for the code.
 */
function useOpenPartEarly(section: EpisodeSection | undefined, channelId: string, episodeId: string) {
  const client = useQueryClient();
  useEffect(() => {
    void section?.preload?.();
    section?.prefetch?.(client, { channelId, episodeId });
  }, [section, client, channelId, episodeId]);
}

/** The open part; switching parts from low on the page brings the new one's top into view. */
function PartView({ part }: { part: Part }) {
  const section = useRef<HTMLElement>(null);
  useEffect(() => {
    const top = section.current?.getBoundingClientRect().top ?? 0;
    if (top < 0) section.current?.scrollIntoView({ block: "start" });
  }, []);
  return (
    <section ref={section} id={part.id} aria-labelledby={`${part.id}-heading`} className="min-w-0 scroll-mt-16 lg:scroll-mt-4">
      <h2 id={`${part.id}-heading`} className="mb-3 text-lg font-semibold">
        {part.title}
      </h2>
      <Suspense fallback={<Loading label={`Opening ${part.title.toLowerCase()}…`} />}>{part.render()}</Suspense>
    </section>
  );
}
