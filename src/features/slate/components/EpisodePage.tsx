import { useEffect, type ReactNode } from "react";
import { Link, useLocation, useParams } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import type { EpisodeDetail } from "@shared/slate/schemas";
import { stageLabels } from "@shared/slate/stages";
import { Notice } from "../../../components/Notice";
import { PageHeader } from "../../../components/PageHeader";
import { QueryState } from "../../../components/States";
import type { EpisodeSection, EpisodeSectionProps } from "../../../lib/episode-sections";
import { useChannel } from "../../../lib/session";
import { useEpisode } from "../api/get-episode";
import { ActivitySection } from "./ActivitySection";
import { Flag } from "./Flag";
import { HistorySection } from "./HistorySection";
import { OverviewSection } from "./OverviewSection";
import { ScheduleSection } from "./ScheduleSection";

export function EpisodePage({ sections }: { sections: EpisodeSection[] }) {
  const channel = useChannel();
  const { episodeId = "" } = useParams();
  return <Episode channelId={channel.channelId} episodeId={episodeId} role={channel.role} sections={sections} />;
}

function Section({ id, title, children }: { id: string; title: string; children: ReactNode }) {
  return (
    <section id={id} aria-labelledby={`${id}-heading`} className="mt-8 scroll-mt-4">
      <h2 id={`${id}-heading`} className="mb-3 text-lg font-semibold">
        {title}
      </h2>
      {children}
    </section>
  );
}

/** One episode: the slate's overview, schedule and history, each feature's section, then the comments. */
function Episode(props: EpisodeSectionProps & { sections: EpisodeSection[] }) {
  const episode = useEpisode(props.channelId, props.episodeId);
  return (
    <QueryState query={episode} loading="Loading the episode…" page back={{ to: `/c/${props.channelId}/slate`, label: "Slate" }}>
      {(detail) => <EpisodeView {...props} detail={detail} />}
    </QueryState>
  );
}

function EpisodeView({ channelId, episodeId, role, sections, detail }: EpisodeSectionProps & { sections: EpisodeSection[]; detail: EpisodeDetail }) {
  const e = detail.episode;
  const canEdit = roleMay(role, "episodes", "W");
  const location = useLocation();
  const justCreated = (location.state as { created?: boolean } | null)?.created === true;
  // A link to a section (a search hit, a mailed link) lands on it once the page is there to scroll.
  useEffect(() => {
    if (location.hash) document.getElementById(decodeURIComponent(location.hash.slice(1)))?.scrollIntoView({ block: "start" });
  }, [location.hash, location.key]);
  const contents = [
    { id: "overview", title: "Overview" },
    { id: "schedule", title: "Schedule" },
    { id: "history", title: "History" },
    ...sections.map(({ id, title }) => ({ id, title })),
    { id: "activity", title: "Activity" },
  ];
  return (
    <article className="mx-auto max-w-4xl">
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
      <nav aria-label="On this page" className="flex flex-wrap gap-3 text-sm">
        {contents.map((c) => (
          <a key={c.id} href={`#${c.id}`} className="text-rust-600 underline">
            {c.title}
          </a>
        ))}
      </nav>
      <Section id="overview" title="Overview">
        <OverviewSection channelId={channelId} detail={detail} canEdit={canEdit} />
      </Section>
      <Section id="schedule" title="Schedule">
        <ScheduleSection channelId={channelId} detail={detail} canEdit={canEdit} />
      </Section>
      <Section id="history" title="History">
        <HistorySection channelId={channelId} episodeId={episodeId} />
      </Section>
      {sections.map(({ id, title, Component }) => (
        <Section key={id} id={id} title={title}>
          <Component channelId={channelId} episodeId={episodeId} role={role} />
        </Section>
      ))}
      <Section id="activity" title="Activity">
        <ActivitySection channelId={channelId} episodeId={episodeId} />
      </Section>
    </article>
  );
}
