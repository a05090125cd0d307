import { useState } from "react";
import { figureKinds, figureLabels, figureSeries, formatFigure, type ExportReading, type FigureKind, type FiguresView, type FigureValues } from "@shared/publish/figures";
import { Button } from "../../../components/Button";
import { FiguresChart } from "../../../components/chart/FiguresChart";
import { Notice } from "../../../components/Notice";
import { NumberField, SelectField, TextField } from "../../../components/form-fields";
import { QueryState } from "../../../components/States";
import { formatDay } from "../../../lib/format";
import { useEnterFigures } from "../api/enter-figures";
import { useFigures } from "../api/get-figures";
import { ExportImport } from "./FiguresImport";

interface Props {
  channelId: string;
  episodeId: string;
  title: string | null;
  canWrite: boolean;
}

/** The video's figures on the days its deals agreed, entered by hand or read from an analytics export, and charted. */
export function Figures(props: Props) {
  const query = useFigures(props.channelId, props.episodeId);
  return (
    <section aria-labelledby="figures-heading" className="space-y-4 rounded-md border border-ply-300 p-4">
      <h3 id="figures-heading" className="font-semibold text-graphite-900">
        Figures after go-live
      </h3>
      <QueryState query={query} loading="Loading the figures…">
        {(figures) => (figures.liveOn ? <FiguresBody {...props} figures={figures} /> : <p className="text-sm text-graphite-700">Figures count from go-live: once the video is marked published, the days the deals agreed get their dates here.</p>)}
      </QueryState>
    </section>
  );
}

function FiguresBody({ channelId, episodeId, title, canWrite, figures }: Props & { figures: FiguresView }) {
  const [day, setDay] = useState<number | null>(figures.days[0]?.day ?? null);
  return (
    <div className="space-y-4">
      <FiguresTable figures={figures} />
      <FiguresChart series={figureSeries(figures.days)} format={formatFigure} subject={title ?? "the video"} />
      {canWrite && (
        <>
          <DayPicker figures={figures} day={day} setDay={setDay} />
          {day !== null && <DayForm key={`${day}-${figures.days.find((d) => d.day === day)?.version ?? 0}`} channelId={channelId} episodeId={episodeId} figures={figures} day={day} title={title} />}
        </>
      )}
    </div>
  );
}

function FiguresTable({ figures }: { figures: FiguresView }) {
  if (figures.days.length === 0) return <p className="text-sm text-graphite-700">No deal of this episode asks for figures on a set day; enter them on any day after go-live below.</p>;
  return (
    <div className="overflow-x-auto">
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Figures by day after go-live on {formatDay(figures.liveOn!)}</caption>
        <thead>
          <tr className="border-b border-ply-300">
            <th scope="col" className="py-1 pr-3">Day</th>
            {figureKinds.map((k) => (
              <th key={k} scope="col" className="py-1 pr-3">
                {figureLabels[k]}
              </th>
            ))}
          </tr>
        </thead>
        <tbody>
          {figures.days.map((d) => (
            <tr key={d.day} className="border-b border-ply-200">
              <th scope="row" className="py-1 pr-3 font-medium">
                Day {d.day}
                <span className="block text-xs font-normal text-graphite-500">
                  {d.dueOn && formatDay(d.dueOn)}
                  {d.agreed ? " · agreed with the sponsor" : ""}
                </span>
              </th>
              {figureKinds.map((k) => (
                <td key={k} className="py-1 pr-3 tabular-nums">
                  {d.values?.[k] == null ? "—" : formatFigure(d.values[k])}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}

function DayPicker({ figures, day, setDay }: { figures: FiguresView; day: number | null; setDay: (d: number | null) => void }) {
  const [other, setOther] = useState("");
  const otherDay = /^\d{1,4}$/.test(other.trim()) ? Number(other) : null;
  return (
    <div className="flex flex-wrap items-end gap-3">
      {figures.days.length > 0 && (
        <SelectField label="Figures of" value={day === null ? "" : String(day)} onChange={(e) => setDay(Number(e.target.value))} options={figures.days.map((d) => ({ value: String(d.day), label: `Day ${d.day}${d.dueOn ? ` (${formatDay(d.dueOn)})` : ""}` }))} />
      )}
      <TextField label="Another day after go-live" inputMode="numeric" value={other} onChange={(e) => setOther(e.target.value)} className="w-40" />
      <Button tone="quiet" type="button" disabled={otherDay === null} onClick={() => setDay(otherDay)}>
        Use that day
      </Button>
    </div>
  );
}

const noValues = (): FigureValues => ({ views: null, watchHours: null, linkClicks: null, codeUses: null });
const textOf = (values: FigureValues | null) => Object.fromEntries(figureKinds.map((k) => [k, values?.[k] == null ? "" : String(values[k])])) as Record<FigureKind, string>;

function valuesOf(text: Record<FigureKind, string>): FigureValues | string {
  const values = noValues();
  for (const kind of figureKinds) {
    const cell = text[kind].replace(/[\s,]/g, "");
    if (cell === "") continue;
    if (!/^\d+(?:\.\d+)?$/.test(cell)) return `${figureLabels[kind]}: write a number, like 1200 or 12.5.`;
    values[kind] = Number(cell);
  }
  return values;
}

function DayForm({ channelId, episodeId, figures, day, title }: { channelId: string; episodeId: string; figures: FiguresView; day: number; title: string | null }) {
  const current = figures.days.find((d) => d.day === day);
  const [text, setText] = useState(() => textOf(current?.values ?? null));
  const [problem, setProblem] = useState<string | null>(null);
  const [reading, setReading] = useState<ExportReading | null>(null);
  const enter = useEnterFigures(channelId, episodeId);
  const save = (values: FigureValues, source: "hand" | "export") => enter.mutate({ day, input: { version: current?.version ?? 0, values, source } }, { onSuccess: () => setReading(null) });
  return (
    <div className="space-y-4">
      <form
        className="space-y-2"
        aria-label={`Figures of day ${day}`}
        onSubmit={(e) => {
          e.preventDefault();
          const values = valuesOf(text);
          setProblem(typeof values === "string" ? values : null);
          if (typeof values !== "string") save(values, "hand");
        }}
      >
        <div className="grid grid-cols-1 gap-2 sm:grid-cols-4">
          {figureKinds.map((k) => (
            <NumberField key={k} label={figureLabels[k]} whole={k !== "watchHours"} value={text[k]} onChange={(e) => setText({ ...text, [k]: e.target.value })} />
          ))}
        </div>
        {problem && <Notice kind="error">{problem}</Notice>}
        {enter.error && <Notice kind="error">{enter.error.message}</Notice>}
        <Button type="submit" busy={enter.isPending}>
          Save day {day}
        </Button>
        {current?.enteredBy && (
          <p className="text-xs text-graphite-500">
            Last entered by {current.enteredBy} {current.source === "export" ? "from an analytics export" : "by hand"}.
          </p>
        )}
      </form>
      <ExportImport channelId={channelId} episodeId={episodeId} figures={figures} title={title} day={day} reading={reading} setReading={setReading} save={(v) => save(v, "export")} busy={enter.isPending} />
    </div>
  );
}
