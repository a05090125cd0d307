import { useState } from "react";
import { Link } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import { bestRun } from "@shared/bench/comparison";
import { Button } from "../../../components/Button";
import { Empty, LoadError, Loading } from "../../../components/States";
import type { EpisodeSectionProps } from "../../../lib/episode-sections";
import { runsCsvUrl } from "../api/export-runs";
import { useTestPlan } from "../api/get-test-plan";
import { useParts } from "../api/list-parts";
import { useRuns } from "../api/list-runs";
import { ComparisonChart } from "./ComparisonChart";
import { ComparisonTable } from "./ComparisonTable";
import { Panel } from "./marks";
import { RunCard } from "./RunCard";
import { RunForm } from "./RunForm";

/** Bench runs of the episode: side-by-side comparison, chart, each run's figures and verdict, and entry. */
export function BenchSection({ channelId, episodeId, role }: EpisodeSectionProps) {
  const runs = useRuns(channelId, episodeId);
  const plan = useTestPlan(channelId, episodeId);
  const parts = useParts(channelId);
  const [adding, setAdding] = useState(false);
  const [editing, setEditing] = useState<string | null>(null);
  const canWrite = roleMay(role, "bench", "W");

  if (runs.isPending || plan.isPending || parts.isPending) return <Loading label="Loading the bench runs…" />;
  if (runs.isError) return <LoadError error={runs.error} retry={() => void runs.refetch()} />;
  if (plan.isError) return <LoadError error={plan.error} retry={() => void plan.refetch()} />;
  if (parts.isError) return <LoadError error={parts.error} retry={() => void parts.refetch()} />;

  const best = bestRun(runs.data);
  const criteria = plan.data.criteria;

  return (
    <div className="flex flex-col gap-6">
      {runs.data.length === 0 ? (
        <Empty title="No bench runs yet">{canWrite ? "Enter the first candidate's measurements below." : "Runs appear here as the crew measures candidates."}</Empty>
      ) : (
        <>
          <Panel>
            <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
              <h3 className="font-semibold">Candidates side by side</h3>
              <a href={runsCsvUrl(channelId, episodeId)} download className="text-sm font-semibold text-rust-600 underline">
                Download the runs as CSV
              </a>
            </div>
            <ComparisonTable runs={runs.data} bestId={best?.id ?? null} />
          </Panel>
          <Panel>
            <ComparisonChart runs={runs.data} best={best} criteria={criteria} />
          </Panel>
        </>
      )}

      {runs.data.length > 0 && (
        <ol className="flex flex-col gap-4" aria-label="Bench runs">
          {runs.data.map((run) =>
            editing === run.id ? (
              <li key={run.id}>
                <Panel>
                  <h3 className="mb-3 font-semibold">Edit run {run.number}</h3>
                  <RunForm channelId={channelId} episodeId={episodeId} parts={parts.data} plan={plan.data} run={run} onDone={() => setEditing(null)} />
                </Panel>
              </li>
            ) : (
              <RunCard key={run.id} channelId={channelId} episodeId={episodeId} run={run} criteria={criteria} isBest={run.id === best?.id} canWrite={canWrite} onEdit={() => setEditing(run.id)} />
            ),
          )}
        </ol>
      )}

      {canWrite &&
        (adding ? (
          <Panel>
            <h3 className="mb-3 font-semibold">New bench run</h3>
            {parts.data.length === 0 && (
              <p className="mb-3 text-sm text-graphite-500">
                The shelf is empty: a run can still be entered with its mass weighed, or{" "}
                <Link to={`/c/${channelId}/shelf`} className="text-rust-600 underline">
                  add parts to the shelf
                </Link>{" "}
                first.
              </p>
            )}
            <RunForm channelId={channelId} episodeId={episodeId} parts={parts.data} plan={plan.data} onDone={() => setAdding(false)} />
          </Panel>
        ) : (
          <div>
            <Button onClick={() => setAdding(true)}>Enter a bench run</Button>
          </div>
        ))}
    </div>
  );
}
