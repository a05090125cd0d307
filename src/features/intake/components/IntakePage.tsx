import { useState } from "react";
import { roleMay } from "@shared/access/roles";
import { ideaSorts, ideaStatuses, ideaStatusLabels, type IdeaSort, type IdeaStatus } from "@shared/intake/schemas";
import { dimensionLabels, dimensions } from "@shared/intake/weighing";
import { PageHeader } from "../../../components/PageHeader";
import { SelectField } from "../../../components/form-fields";
import { Empty, QueryState } from "../../../components/States";
import { useChannel } from "../../../lib/session";
import { useIdeas } from "../api/list-ideas";
import { HandEntry } from "./HandEntry";
import { IdeaCard } from "./IdeaCard";
import { ImportPanel } from "./ImportPanel";
import { PagePanel } from "./PagePanel";

const sortLabels: Record<IdeaSort, string> = {
  people: "Most people asking",
  latest: "Asked most recently",
  combined: "Combined judgement",
  ...(Object.fromEntries(dimensions.map((d) => [d, `${dimensionLabels[d].name} (highest first)`])) as Record<(typeof dimensions)[number], string>),
};

/** What viewers ask the channel for, grouped into ideas, weighed by the members, promoted to the slate. */
export function IntakePage() {
  const channel = useChannel();
  const [status, setStatus] = useState<IdeaStatus>("open");
  const [sort, setSort] = useState<IdeaSort>("people");
  const ideas = useIdeas(channel.channelId, status, sort);
  const runsPage = roleMay(channel.role, "intakePage", "W");
  return (
    <div className="mx-auto flex max-w-5xl flex-col gap-6">
      <PageHeader title="Viewer asks" subtitle={`What viewers ask ${channel.channelName} to try, grouped into ideas.`} />
      <div className="grid gap-4 md:grid-cols-2">
        <PagePanel channelId={channel.channelId} canChange={runsPage} />
        <HandEntry channelId={channel.channelId} />
      </div>
      {runsPage && <ImportPanel channelId={channel.channelId} />}
      <section aria-labelledby="ideas-heading" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-end justify-between gap-3">
          <h2 id="ideas-heading" className="text-lg font-semibold">
            Ideas
          </h2>
          <div className="flex flex-wrap gap-3">
            <SelectField label="Ideas to show" value={status} onChange={(e) => setStatus(e.target.value as IdeaStatus)} options={ideaStatuses.map((s) => ({ value: s, label: ideaStatusLabels[s] }))} />
            <SelectField label="Order" value={sort} onChange={(e) => setSort(e.target.value as IdeaSort)} options={ideaSorts.map((s) => ({ value: s, label: sortLabels[s] }))} />
          </div>
        </div>
        <QueryState
          query={ideas}
          loading="Loading the ideas…"
          isEmpty={(data) => data.ideas.length === 0}
          empty={<Empty title={status === "open" ? "No open ideas yet" : `No ideas are ${ideaStatusLabels[status].toLowerCase()}`}>Suggestions from the public page, imports and members land here, grouped by what they ask.</Empty>}
        >
          {(data) => (
            <>
              {data.total > data.ideas.length && <p className="text-sm text-graphite-500">Showing the first {data.ideas.length} of {data.total} ideas in this order.</p>}
              <ul className="flex flex-col gap-3">
                {data.ideas.map((idea) => (
                  <li key={idea.id}>
                    <IdeaCard channelId={channel.channelId} idea={idea} others={data.ideas.filter((o) => o.id !== idea.id)} mayPromote={roleMay(channel.role, "episodes", "W")} />
                  </li>
                ))}
              </ul>
            </>
          )}
        </QueryState>
      </section>
    </div>
  );
}
