import { Link } from "react-router-dom";
import { roleLabels } from "@shared/access/roles";
import type { NeedEntry, NeedGroup, NeedTone } from "@shared/home/needs";
import { PageHeader } from "../../../components/PageHeader";
import { Empty, QueryState } from "../../../components/States";
import { formatDay } from "../../../lib/format";
import { useChannel } from "../../../lib/session";
import { useHome } from "../api/get-home";

/** Said under a group with nothing in it, so a quiet group reads as good news, not as a fault. */
const quietWords: Record<NeedGroup, string> = {
  at_risk: "Every episode is on schedule.",
  gate_waiting: "No stage due this week is missing its essentials.",
  sponsor_item: "No sponsor item needs chasing.",
  unlogged_clip: "Every clip has a rating.",
  cut_review: "No segment cut is due this week.",
  shoot_today: "No shoot day today or ahead.",
  shot_to_get: "No shots waiting.",
  hazard_to_check: "Every listed hazard has been checked.",
};

const toneEdge: Record<NeedTone, string> = {
  alarm: "border-alarm-600",
  warn: "border-amber-cut",
  info: "border-ply-300",
};

const toneWord: Record<NeedTone, string> = { alarm: "Urgent: ", warn: "Soon: ", info: "" };

/** The member's home, the first page after sign-in: what needs them today, by what their role does. */
export function HomePage() {
  const channel = useChannel();
  const home = useHome(channel.channelId);
  return (
    <div className="mx-auto max-w-3xl">
      <PageHeader
        title="What needs you"
        subtitle={home.data ? `${roleLabels[channel.role]} · ${formatDay(home.data.today)} (${home.data.timeZone})` : roleLabels[channel.role]}
      />
      <QueryState query={home} loading="Finding what needs you…" page>
        {(data) =>
          data.groups.every((group) => group.entries.length === 0) ? (
            <Empty title="Nothing needs you today">Whatever turns late, comes due or waits on you will show here, with a link to where it is done.</Empty>
          ) : (
            <div className="flex flex-col gap-8">
              {data.groups.map(({ group, label, entries }) => (
                <Group key={group} group={group} label={label} entries={entries} />
              ))}
            </div>
          )
        }
      </QueryState>
    </div>
  );
}

function Group({ group, label, entries }: { group: NeedGroup; label: string; entries: NeedEntry[] }) {
  const headingId = `home-${group}`;
  return (
    <section aria-labelledby={headingId}>
      <h2 id={headingId} className="mb-2 text-lg font-semibold">
        {label} <span className="font-normal text-graphite-500">({entries.length})</span>
      </h2>
      {entries.length === 0 ? (
        <p className="text-sm text-graphite-500">{quietWords[group]}</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {entries.map((entry) => (
            <Entry key={entry.key} entry={entry} />
          ))}
        </ul>
      )}
    </section>
  );
}

function Entry({ entry }: { entry: NeedEntry }) {
  return (
    <li className={`rounded-md border-l-4 bg-white px-4 py-3 shadow-sm ${toneEdge[entry.tone]}`}>
      <div className="flex flex-wrap items-baseline justify-between gap-x-4 gap-y-1">
        <Link to={entry.href} className="font-medium break-words text-graphite-900 underline decoration-ply-300 hover:decoration-rust-600">
          <span className="sr-only">{toneWord[entry.tone]}</span>
          {entry.title}
        </Link>
        {entry.date && <span className="text-sm whitespace-nowrap text-graphite-700">{formatDay(entry.date)}</span>}
      </div>
      <p className="mt-1 text-sm break-words text-graphite-700">{entry.detail}</p>
    </li>
  );
}
