import { useState } from "react";
import { Link, useNavigate, useParams } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import { formatFigure, formatQuantity } from "@shared/bench/format";
import { partKindLabels, type PartRunView, type PartView } from "@shared/bench/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { PageHeader } from "../../../components/PageHeader";
import { Empty, QueryState } from "../../../components/States";
import { formatInstantDay } from "../../../lib/format";
import { useChannel, useTimeZone } from "../../../lib/session";
import { useDeletePart } from "../api/delete-part";
import { usePart } from "../api/get-part";
import { useUpdatePart } from "../api/update-part";
import { Panel, VerdictBadge } from "./marks";
import { PartForm } from "./PartForm";
import { priceText } from "./ShelfPage";

/** One part of the shelf and every run it was in, across the channel's episodes. */
export function PartPage() {
  const channel = useChannel();
  const { partId = "" } = useParams();
  return <Part channelId={channel.channelId} partId={partId} canWrite={roleMay(channel.role, "bench", "W")} />;
}

function Part({ channelId, partId, canWrite }: { channelId: string; partId: string; canWrite: boolean }) {
  const page = usePart(channelId, partId);
  return (
    <QueryState query={page} loading="Loading the part…" page back={{ to: `/c/${channelId}/shelf`, label: "Shelf" }}>
      {({ part, runs }) => <PartSheet channelId={channelId} part={part} runs={runs} canWrite={canWrite} />}
    </QueryState>
  );
}

function PartSheet({ channelId, part, runs, canWrite }: { channelId: string; part: PartView; runs: PartRunView[]; canWrite: boolean }) {
  const update = useUpdatePart(channelId);
  const remove = useDeletePart(channelId);
  const navigate = useNavigate();
  const [editing, setEditing] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);

  return (
    <div className="mx-auto max-w-4xl">
      <Link to={`/c/${channelId}/shelf`} className="text-sm text-rust-600 underline">
        ← Shelf
      </Link>
      <PageHeader
        title={part.name}
        subtitle={partKindLabels[part.kind]}
        actions={
          canWrite && !editing ? (
            <>
              <Button tone="quiet" onClick={() => setEditing(true)}>
                Edit
              </Button>
              <Button
                tone="danger"
                busy={remove.isPending}
                onClick={async () => {
                  if (!window.confirm(`Take ${part.name} off the shelf?`)) return;
                  setProblem(null);
                  try {
                    await remove.mutateAsync(part.id);
                    navigate(`/c/${channelId}/shelf`);
                  } catch (error) {
                    setProblem((error as Error).message);
                  }
                }}
              >
                Remove
              </Button>
            </>
          ) : undefined
        }
      />
      {problem && (
        <div className="mb-4">
          <Notice kind="error">{problem}</Notice>
        </div>
      )}
      {editing ? (
        <Panel className="mb-6">
          <PartForm part={part} busy={update.isPending} onSave={async (input, version) => {
              await update.mutateAsync({ id: part.id, input, version });
              setEditing(false);
            }} onCancel={() => setEditing(false)} />
        </Panel>
      ) : (
        <PartDetails part={part} />
      )}
      <section aria-labelledby="part-runs" className="mt-8">
        <h2 id="part-runs" className="mb-3 text-lg font-semibold">
          Runs with this part
        </h2>
        {runs.length === 0 ? <Empty title="Not measured yet">Runs that use this part show up here, from every episode.</Empty> : <PartRuns channelId={channelId} runs={runs} />}
      </section>
    </div>
  );
}

function PartDetails({ part }: { part: PartView }) {
  const rows: [string, string][] = [
    ["Mass", part.mass ? formatQuantity(part.mass) : "not weighed"],
    ["Rated voltage", part.ratedVoltage ? formatQuantity(part.ratedVoltage) : part.powered ? "not recorded: check the maker's rating" : "takes no power"],
    ["Rated current", part.ratedCurrent ? formatQuantity(part.ratedCurrent) : "not recorded"],
    ["Price", priceText(part) ?? "–"],
    ["Supplier", part.supplier || "–"],
  ];
  return (
    <Panel>
      <dl className="grid gap-y-2 text-sm sm:grid-cols-[10rem_1fr]">
        {rows.map(([label, value]) => (
          <div key={label} className="contents">
            <dt className="text-graphite-500">{label}</dt>
            <dd>{value}</dd>
          </div>
        ))}
      </dl>
      {part.notes && <p className="mt-3 whitespace-pre-wrap text-sm text-graphite-700">{part.notes}</p>}
    </Panel>
  );
}

function PartRuns({ channelId, runs }: { channelId: string; runs: PartRunView[] }) {
  const timeZone = useTimeZone();
  return (
    <div className="overflow-x-auto rounded-lg border border-ply-300 bg-white">
      <table className="w-full text-sm">
        <caption className="sr-only">Every run this part was in</caption>
        <thead className="border-b border-ply-300 bg-ply-50 text-left">
          <tr>
            {["Episode", "Run", "How many", "Thrust per watt", "Verdict", "Entered"].map((heading) => (
              <th key={heading} scope="col" className="px-3 py-2 font-semibold">
                {heading}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {runs.map((run) => (
            <tr key={run.runId} className="border-b border-ply-200 last:border-0">
              <td className="px-3 py-2">
                <Link to={`/c/${channelId}/episodes/${run.episodeId}/bench`} className="text-rust-600 underline">
                  {run.episodeTitle}
                </Link>
              </td>
              <td className="px-3 py-2">
                Run {run.runNumber}: {run.label}
                {run.overRated && <span className="ml-2 rounded bg-amber-cut px-1.5 py-0.5 text-xs font-semibold">over-rated</span>}
              </td>
              <td className="px-3 py-2 tabular-nums">{run.count}</td>
              <td className="px-3 py-2">{formatFigure(run.thrustPerWatt)}</td>
              <td className="px-3 py-2">
                <VerdictBadge verdict={run.verdict} />
              </td>
              <td className="px-3 py-2">{formatInstantDay(run.createdAt, timeZone)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
