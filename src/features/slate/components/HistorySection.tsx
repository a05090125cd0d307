import type { EpisodeHistory } from "@shared/slate/schemas";
import { stageLabels } from "@shared/slate/stages";
import { Empty, QueryState } from "../../../components/States";
import { formatDuration, formatInstant } from "../../../lib/format";
import { useTimeZone } from "../../../lib/session";
import { useHistory } from "../api/get-history";

/** Every stage move (who, when, from, to, why) and the time spent in each stage, from those moves. */
export function HistorySection({ channelId, episodeId }: { channelId: string; episodeId: string }) {
  const history = useHistory(channelId, episodeId);
  const timeZone = useTimeZone();
  return (
    <QueryState query={history} loading="Loading the history…">
      {(data) => <History history={data} timeZone={timeZone} />}
    </QueryState>
  );
}

function History({ history: { entries, timeInStage }, timeZone }: { history: EpisodeHistory; timeZone: string }) {
  const visited = timeInStage.filter((t) => t.visits > 0);
  return (
    <div className="grid gap-4 md:grid-cols-[1fr_16rem]">
      <div className="rounded-lg border border-ply-300 bg-white p-5">
        {entries.length === 0 ? (
          <Empty title="No moves recorded yet" />
        ) : (
          <ol className="space-y-3 text-sm">
            {[...entries].reverse().map((entry) => (
              <li key={entry.id} className="border-l-2 border-ply-300 pl-3">
                <p>
                  <span className="font-medium">{entry.byName ?? "Someone no longer here"}</span>{" "}
                  {entry.from === null ? (
                    <>started it in {stageLabels[entry.to]}</>
                  ) : (
                    <>
                      moved it from {stageLabels[entry.from]} to <span className="font-medium">{stageLabels[entry.to]}</span>
                    </>
                  )}
                </p>
                <p className="text-xs text-graphite-500">
                  <time dateTime={entry.at}>{formatInstant(entry.at, timeZone)}</time>
                </p>
                {entry.skipped.length > 0 && <p className="mt-1 text-xs text-rust-700">Missing then: {entry.skipped.map((p) => p.message).join(" ")}</p>}
                {entry.reason && <p className="mt-1 text-xs italic text-graphite-700">“{entry.reason}”</p>}
              </li>
            ))}
          </ol>
        )}
      </div>
      <div className="rounded-lg border border-ply-300 bg-white p-5">
        <h3 className="mb-2 text-sm font-semibold">Time in each stage</h3>
        <table className="w-full text-sm">
          <tbody>
            {visited.map((t) => (
              <tr key={t.stage} className="border-b border-ply-200 last:border-0">
                <th scope="row" className="py-1 pr-2 text-left font-normal text-graphite-700">
                  {stageLabels[t.stage]}
                </th>
                <td className="py-1 text-right font-medium">
                  {formatDuration(t.ms, { smallest: "h" })}
                  {t.visits > 1 && <span className="block text-xs font-normal text-graphite-500">{t.visits} stays</span>}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </div>
  );
}
