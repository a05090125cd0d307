import { useState } from "react";
import type { EpisodeDetail } from "@shared/slate/schemas";
import type { ScheduledStage } from "@shared/slate/schedule";
import { stageIndex, stageLabels } from "@shared/slate/stages";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { Empty } from "../../../components/States";
import { isConflict } from "../api/episode-mutation";
import { useOverrideDueDate } from "../api/override-due-date";
import { slateSchemas } from "../schemas-later";
import { Flag } from "./Flag";
import { formatDay } from "../../../lib/format";

/** A stage under way started when the episode entered it, whatever the plan says; one behind it is done. */
function startCell(fromCurrent: number, plannedStart: string, enteredOn: string) {
  if (fromCurrent < 0) return <span className="text-graphite-500">done</span>;
  if (fromCurrent === 0) return `Started ${formatDay(enteredOn, { withYear: false })}`;
  return formatDay(plannedStart, { withYear: false });
}

/** Each stage's dates, counted back in working days from the target publish date; one can be set by hand. */
export function ScheduleSection({ channelId, detail, canEdit }: { channelId: string; detail: EpisodeDetail; canEdit: boolean }) {
  const { episode, schedule, today } = detail;
  const [notice, setNotice] = useState<string | null>(null);
  if (!schedule) {
    return <Empty title="No target publish date yet">Set one in the overview: Kerf counts each stage's due date back from it, in working days.</Empty>;
  }
  const riskFlags = detail.flags.filter((f) => f.code.startsWith("slate.stage_overdue") || f.code.startsWith("slate.plan_in_past"));
  const current = stageIndex(episode.stage);
  return (
    <div className="rounded-lg border border-ply-300 bg-white p-3 sm:p-5">
      {riskFlags.length > 0 && (
        <div className="mb-3 flex flex-col gap-1">
          {riskFlags.map((flag) => (
            <p key={flag.code} className="flex items-center gap-2 text-sm">
              <Flag flag={flag} /> {flag.detail}
            </p>
          ))}
        </div>
      )}
      {notice && (
        <div className="mb-3">
          <Notice kind="error">{notice}</Notice>
        </div>
      )}
      {/* On a phone the table with its date fields scrolls within its box, not the page. */}
      <div className="overflow-x-auto" role="region" aria-label="Stage dates" tabIndex={0}>
        <table className="w-full text-left text-sm">
          <caption className="mb-2 text-left text-xs text-graphite-500">
            Working days, Monday to Friday (public holidays are not known to Kerf). Publishes {formatDay(episode.targetPublishDate)}; today is {formatDay(today)}.
          </caption>
          <thead className="border-b border-ply-300 text-xs uppercase tracking-wide text-graphite-500">
            <tr>
              <th scope="col" className="py-2 pr-3 font-semibold">
                Stage
              </th>
              <th scope="col" className="py-2 pr-3 font-semibold">
                Days
              </th>
              <th scope="col" className="py-2 pr-3 font-semibold">
                Starts
              </th>
              <th scope="col" className="py-2 pr-3 font-semibold">
                Due
              </th>
              {canEdit && (
                <th scope="col" className="py-2 font-semibold">
                  Set by hand
                </th>
              )}
            </tr>
          </thead>
          <tbody>
            {schedule.map((row, i) => (
              <tr key={row.stage} className={`border-b border-ply-200 ${i === current ? "bg-amber-cut/15" : ""}`} aria-current={i === current ? "step" : undefined}>
                <th scope="row" className="py-2 pr-3 font-medium">
                  {stageLabels[row.stage]}
                  {i === current && <span className="ml-2 text-xs font-normal text-graphite-500">(now)</span>}
                </th>
                <td className="py-2 pr-3">{row.lengthDays}</td>
                <td className="py-2 pr-3">{startCell(i - current, row.start, detail.stageEnteredOn)}</td>
                <td className={`py-2 pr-3 ${i >= current && row.due < today && row.stage !== "publish" ? "font-semibold text-alarm-600" : ""}`} data-testid={`due-${row.stage}`}>
                  {formatDay(row.due, { withYear: false })}
                  {row.overridden && <span className="ml-2 text-xs text-graphite-500">(counted: {formatDay(row.countedDue, { withYear: false })})</span>}
                </td>
                {canEdit && (
                  <td className="py-2">
                    {row.stage === "publish" ? (
                      <span className="text-xs text-graphite-500">the target date</span>
                    ) : (
                      <OverrideControl key={row.due} channelId={channelId} episodeId={episode.id} version={episode.version} row={row} onError={setNotice} />
                    )}
                  </td>
                )}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}

function OverrideControl({ channelId, episodeId, version, row, onError }: { channelId: string; episodeId: string; version: number; row: ScheduledStage; onError: (m: string | null) => void }) {
  const override = useOverrideDueDate(channelId, episodeId);
  const [value, setValue] = useState(row.due);
  const [fieldError, setFieldError] = useState<string | null>(null);
  const save = async (dueDate: string | null) => {
    onError(null);
    if (dueDate !== null) {
      const { isoDateSchema } = await slateSchemas();
      const parsed = isoDateSchema.safeParse(dueDate);
      if (!parsed.success) return setFieldError(parsed.error.issues[0]?.message ?? "Pick a date.");
    }
    setFieldError(null);
    override.mutate(
      { stage: row.stage, version, dueDate },
      { onError: (error) => onError(isConflict(error) ? "Someone else changed this episode a moment ago; the schedule now shows their version. Set the date again if it still applies." : error.message) },
    );
  };
  const label = `Due date of ${stageLabels[row.stage]}`;
  return (
    <div className="flex flex-wrap items-center gap-1">
      <input type="date" aria-label={label} value={value} onChange={(e) => setValue(e.target.value)} aria-invalid={fieldError ? true : undefined} className="rounded border border-ply-300 px-1.5 py-1 text-sm" />
      <Button tone="quiet" className="px-2 py-1" busy={override.isPending} disabled={value === row.due} onClick={() => void save(value)}>
        Set
      </Button>
      {row.overridden && (
        <Button tone="quiet" className="px-2 py-1" onClick={() => void save(null)}>
          Use counted
        </Button>
      )}
      {fieldError && <p className="w-full text-xs text-alarm-600">{fieldError}</p>}
    </div>
  );
}
