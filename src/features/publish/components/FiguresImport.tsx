import { useState } from "react";
import { figureKinds, figureLabels, figuresFromExport, formatFigure, videoKeys, type ExportReading, type FigureColumns, type FiguresView, type FigureValues } from "@shared/publish/figures";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { TextField } from "../../../components/form-fields";
import { useSaveFigureColumns } from "../api/enter-figures";

const emptyColumns: FigureColumns = { video: null, views: null, watchHours: null, linkClicks: null, codeUses: null };
const columnFields = ["video", ...figureKinds] as const;
const columnLabels: Record<(typeof columnFields)[number], string> = { video: "Column naming the video (its id or title)", ...figureLabels };

/** An analytics export read through the channel's column names, shown before anything is saved. */
export function ExportImport({ channelId, episodeId, figures, title, day, reading, setReading, save, busy }: { channelId: string; episodeId: string; figures: FiguresView; title: string | null; day: number; reading: ExportReading | null; setReading: (r: ExportReading | null) => void; save: (v: FigureValues) => void; busy: boolean }) {
  const saved = figures.columns;
  const [editing, setEditing] = useState(saved === null);
  const [columns, setColumns] = useState<FigureColumns>(saved ?? emptyColumns);
  const saveColumns = useSaveFigureColumns(channelId, episodeId);
  async function read(file: File) {
    setReading(figuresFromExport(await file.text(), saved ?? columns, videoKeys(figures.videoUrl, title)));
  }
  return (
    <fieldset className="min-w-0 space-y-2 rounded-md border border-ply-300 p-3">
      <legend className="px-1 text-sm font-semibold text-graphite-900">From an analytics export (CSV)</legend>
      {editing ? (
        <form
          className="space-y-2"
          onSubmit={(e) => {
            e.preventDefault();
            saveColumns.mutate(columns, { onSuccess: () => setEditing(false) });
          }}
        >
          <p className="text-xs text-graphite-500">Name the export&apos;s columns once, as its first row writes them; every episode of the channel uses them.</p>
          <div className="grid grid-cols-1 gap-2 sm:grid-cols-2">
            {columnFields.map((f) => (
              <TextField key={f} label={columnLabels[f]} value={columns[f] ?? ""} onChange={(e) => setColumns({ ...columns, [f]: e.target.value.trim() === "" ? null : e.target.value })} />
            ))}
          </div>
          {saveColumns.error && <Notice kind="error">{saveColumns.error.message}</Notice>}
          <Button type="submit" busy={saveColumns.isPending}>
            Keep these columns
          </Button>
        </form>
      ) : (
        <div className="space-y-2">
          <p className="text-xs text-graphite-500">
            Columns: {columnFields.filter((f) => saved?.[f]).map((f) => `${f === "video" ? "video" : figureLabels[f].toLowerCase()} from "${saved?.[f]}"`).join(", ")}.{" "}
            <button type="button" className="underline" onClick={() => setEditing(true)}>
              Change the columns
            </button>
          </p>
          <label className="block text-sm font-medium text-graphite-700">
            Read an export
            <input type="file" accept=".csv,text/csv" className="mt-1 block w-full text-sm" onChange={(e) => e.target.files?.[0] && void read(e.target.files[0])} />
          </label>
        </div>
      )}
      {reading && <Preview reading={reading} day={day} save={save} busy={busy} />}
    </fieldset>
  );
}

function Preview({ reading, day, save, busy }: { reading: ExportReading; day: number; save: (v: FigureValues) => void; busy: boolean }) {
  return (
    <div role="status" className="space-y-2 text-sm">
      {reading.values && (
        <>
          <p>Read from row {reading.row}, nothing saved yet:</p>
          <ul className="list-disc pl-5">
            {figureKinds.map((k) => (
              <li key={k}>
                {figureLabels[k]}: {reading.values![k] == null ? "not in the export" : formatFigure(reading.values![k])}
              </li>
            ))}
          </ul>
        </>
      )}
      {reading.problems.length > 0 && (
        <ul className="list-disc pl-5 text-alarm-600">
          {reading.problems.map((p) => (
            <li key={p}>{p}</li>
          ))}
        </ul>
      )}
      {reading.values && reading.problems.length === 0 && (
        <Button type="button" busy={busy} onClick={() => save(reading.values!)}>
          Save these as day {day}
        </Button>
      )}
    </div>
  );
}
