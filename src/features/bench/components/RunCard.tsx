import { useState } from "react";
import { Link } from "react-router-dom";
import { type Role, roleMay } from "@shared/access/roles";
import { columnUnit, describeSupply } from "@shared/bench/comparison";
import { type Figure, figureNames, isQuantity, measurementSymbols } from "@shared/bench/figures";
import { formatFigure, formatQuantity, metricLabels } from "@shared/bench/format";
import { readCriterion } from "@shared/bench/read-criterion";
import type { CriterionView, RunView } from "@shared/bench/schemas";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { FootageShown } from "../../../lib/footage-shown";
import { useDeleteRun } from "../api/delete-run";
import { asEntered } from "./as-entered";
import { Caution, OutcomeMark, VerdictBadge } from "./marks";

/** One run: what was on the bench, what was read (as entered), what Kerf derived, and how the plan judges it. */
export function RunCard({
  channelId,
  episodeId,
  run,
  criteria,
  isBest,
  role,
  onEdit,
}: {
  channelId: string;
  episodeId: string;
  run: RunView;
  criteria: CriterionView[];
  isBest: boolean;
  role: Role;
  onEdit: () => void;
}) {
  const canWrite = roleMay(role, "bench", "W");
  const remove = useDeleteRun(channelId, episodeId);
  const [problem, setProblem] = useState<string | null>(null);
  const e = run.evaluation;
  const byId = new Map(criteria.map((criterion) => [criterion.id, criterion]));
  const overRated = e.ratings.filter((flag) => flag.check.status === "over_rated");
  const unrated = e.ratings.filter((flag) => flag.check.status === "no_rating");

  return (
    <li aria-label={`Run ${run.number}: ${run.label}`} className={`rounded-lg border bg-white p-5 ${isBest ? "border-moss-600 ring-2 ring-moss-600/30" : "border-ply-300"}`}>
      <div className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h3 className="font-semibold">
            <span className="text-graphite-500">Run {run.number} · </span>
            {run.label}
          </h3>
          {isBest && <p className="text-xs font-semibold text-moss-600">Best candidate so far: meets the plan with the most thrust per watt</p>}
        </div>
        <VerdictBadge verdict={e.verdict} />
      </div>

      <p className="mt-2 text-sm text-graphite-700">
        {run.parts.length > 0
          ? run.parts.map((part, index) => (
              <span key={part.partId}>
                {index > 0 && " + "}
                {part.count} ×{" "}
                <Link to={`/c/${channelId}/shelf/${part.partId}`} className="text-rust-600 underline">
                  {part.name}
                </Link>
              </span>
            ))
          : "No shelf parts named."}
        {run.supply && <span> · {describeSupply(run.supply)}</span>}
      </p>

      <div className="mt-3 grid gap-4 sm:grid-cols-2">
        <div>
          <p className="mb-1 text-xs font-semibold uppercase tracking-wide text-graphite-500">Measured</p>
          <dl className="grid grid-cols-[8rem_1fr] gap-y-1 text-sm">
            {measurementSymbols.map((symbol) => {
              const entered = run.measurements[symbol];
              const shown = symbol === "mass" && e.massSource === "shelf" ? massText(e.values.mass, e.massSource) : entered ? asEntered(entered, columnUnit(symbol)) : "–";
              return (
                <div key={symbol} className="contents">
                  <dt className="text-graphite-500">{metricLabels[symbol]}</dt>
                  <dd>{shown}</dd>
                </div>
              );
            })}
          </dl>
        </div>
        <div>
          <p className="mb-1 text-xs font-semibold uppercase tracking-wide text-graphite-500">Derived</p>
          <dl className="grid grid-cols-[9rem_1fr] gap-y-1 text-sm">
            {figureNames.map((name) => (
              <div key={name} className="contents">
                <dt className="text-graphite-500">{metricLabels[name]}</dt>
                <dd className="font-medium">{formatFigure(e.figures[name])}</dd>
              </div>
            ))}
            <dt className="text-graphite-500">All-up mass</dt>
            <dd>{formatFigure(e.allUpMass)}</dd>
          </dl>
        </div>
      </div>

      {e.results.length > 0 && (
        <ul className="mt-3 flex flex-col gap-1 border-t border-ply-200 pt-3 text-sm" aria-label={`Criteria for run ${run.number}`}>
          {e.results.map((result) => {
            const criterion = byId.get(result.criterionId);
            return (
              <li key={result.criterionId} className="flex flex-wrap justify-between gap-2">
                <span className="tabular-nums">
                  {criterion ? readCriterion(criterion, e.values[criterion.metric]) : "A criterion"}
                  {!result.required && <span className="text-graphite-500"> (informative)</span>}
                </span>
                <OutcomeMark outcome={result.outcome} />
              </li>
            );
          })}
        </ul>
      )}

      <div className="mt-3 flex flex-col gap-2">
        {overRated.map((flag) =>
          flag.check.status === "over_rated" ? (
            <Caution key={flag.partId} title={`Over-rated: ${flag.partName} (${formatQuantity(flag.check.overBy)} over)`}>
              {flag.check.caution}
            </Caution>
          ) : null,
        )}
        {e.pack?.low?.status === "below_minimum" && <Caution title={`${e.pack.label} pack run low`}>{e.pack.low.caution}</Caution>}
        {unrated.length > 0 && <p className="text-xs text-graphite-500">No rated voltage on the shelf for {unrated.map((flag) => flag.partName).join(", ")}: check the maker's rating before powering it.</p>}
        {e.figures.thrust_to_weight === "not_measured" && e.allUpMass === "not_measured" && isQuantity(e.values.thrust) && (
          <p className="text-xs text-graphite-500">Thrust-to-weight needs the airframe mass on the test plan and a weighed configuration.</p>
        )}
      </div>

      {run.notes && <p className="mt-3 whitespace-pre-wrap text-sm text-graphite-700">{run.notes}</p>}

      <FootageShown channelId={channelId} episodeId={episodeId} role={role} shows={{ kind: "run", id: run.id, number: run.number }} />

      {canWrite && (
        <div className="mt-3 flex gap-2">
          <Button tone="quiet" onClick={onEdit}>
            Edit
          </Button>
          <Button
            tone="danger"
            busy={remove.isPending}
            onClick={async () => {
              if (!window.confirm(`Delete run ${run.number} (${run.label})?`)) return;
              setProblem(null);
              try {
                await remove.mutateAsync(run.id);
              } catch (error) {
                setProblem((error as Error).message);
              }
            }}
          >
            Delete
          </Button>
        </div>
      )}
      {problem && (
        <div className="mt-2">
          <Notice kind="error">{problem}</Notice>
        </div>
      )}
    </li>
  );
}

function massText(mass: Figure | undefined, source: RunView["evaluation"]["massSource"]) {
  if (!isQuantity(mass)) return "–";
  return source === "shelf" ? `${formatQuantity(mass)} (from the shelf)` : formatQuantity(mass);
}
