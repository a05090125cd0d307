import { useState } from "react";
import { Link } from "react-router-dom";
import { type Role, roleMay } from "@shared/access/roles";
import { bestRun } from "@shared/bench/comparison";
import type { PartView, RunView, TestPlanView } from "@shared/bench/schemas";
import { FormOpener } from "../../../components/FormOpener";
import { allOf, Empty, QueryState } from "../../../components/States";
import type { EpisodeSectionProps } from "../../../lib/episode-sections";
import { runsCsvUrl } from "../api/export-runs";
import { useTestPlan } from "../api/get-test-plan";
import { useParts } from "../api/list-parts";
import { useRuns } from "../api/list-runs";
import { ComparisonChart } from "./ComparisonChart";
import { ComparisonTable } from "./ComparisonTable";
import { Panel } from "./marks";
import { ResultsCard } from "./ResultsCard";
import { RunCard } from "./RunCard";
import { RunForm } from "./RunForm";

/** Bench runs of the episode: side-by-side comparison, chart, each run's figures and verdict, and entry. */
export function BenchSection({ channelId, episodeId, role }: EpisodeSectionProps) {
  const bench = allOf(useRuns(channelId, episodeId), useTestPlan(channelId, episodeId), useParts(channelId));
  return (
    <QueryState query={bench} loading="Loading the bench runs…">
      {([runs, plan, parts]) => <Bench channelId={channelId} episodeId={episodeId} role={role} runs={runs} plan={plan} parts={parts} />}
    </QueryState>
  );
}

function Bench({ channelId, episodeId, role, runs, plan, parts }: { channelId: string; episodeId: string; role: Role; runs: RunView[]; plan: TestPlanView; parts: PartView[] }) {
  const canWrite = roleMay(role, "bench", "W");
  const [editing, setEditing] = useState<string | null>(null);
  const best = bestRun(runs);
  const criteria = plan.criteria;

  return (
    <div className="flex flex-col gap-6">
      {runs.length === 0 ? (
        <Empty title="No bench runs yet">{canWrite ? "Enter the first candidate's measurements below." : "Runs appear here as the crew measures candidates."}</Empty>
      ) : (
        <>
          <div className="grid grid-cols-[minmax(0,1fr)] items-start gap-6 xl:grid-cols-2">
            <Panel>
              <div className="mb-3 flex flex-wrap items-baseline justify-between gap-2">
                <h3 className="font-semibold">Candidates side by side</h3>
                <a href={runsCsvUrl(channelId, episodeId)} download className="text-sm font-semibold text-rust-600 underline">
                  Download the runs as CSV
                </a>
              </div>
              <ComparisonTable runs={runs} bestId={best?.id ?? null} criteria={criteria} />
            </Panel>
            <Panel>
              <ComparisonChart runs={runs} best={best} criteria={criteria} />
            </Panel>
          </div>
          <ResultsCard channelId={channelId} episodeId={episodeId} role={role} />
        </>
      )}

      {runs.length > 0 && (
        <ol className="grid grid-cols-[minmax(0,1fr)] items-start gap-4 xl:grid-cols-2" aria-label="Bench runs">
          {runs.map((run) =>
            editing === run.id ? (
              <li key={run.id}>
                <Panel>
                  <h3 className="mb-3 font-semibold">Edit run {run.number}</h3>
                  <RunForm channelId={channelId} episodeId={episodeId} parts={parts} plan={plan} run={run} onDone={() => setEditing(null)} />
                </Panel>
              </li>
            ) : (
              <RunCard key={run.id} channelId={channelId} episodeId={episodeId} run={run} criteria={criteria} isBest={run.id === best?.id} role={role} onEdit={() => setEditing(run.id)} />
            ),
          )}
        </ol>
      )}

      {canWrite && (
        <FormOpener label="Enter a bench run">
          {(close) => (
            <Panel>
              <h3 className="mb-3 font-semibold">New bench run</h3>
              {parts.length === 0 && (
                <p className="mb-3 text-sm text-graphite-500">
                  The shelf is empty: a run can still be entered with its mass weighed, or{" "}
                  <Link to={`/c/${channelId}/shelf`} className="text-rust-600 underline">
                    add parts to the shelf
                  </Link>{" "}
                  first.
                </p>
              )}
              <RunForm channelId={channelId} episodeId={episodeId} parts={parts} plan={plan} onDone={close} />
            </Panel>
          )}
        </FormOpener>
      )}
    </div>
  );
}
