import { useEffect, useRef, useState } from "react";
import { calendarKindLabels, type CalendarEntry, type PublishMovePreview } from "@shared/calendar/entries";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { explain } from "../../../components/States";
import { formatDay } from "../../../lib/format";
import { useMovePublishDate } from "../api/move-publish-date";
import { usePreviewPublishMove } from "../api/preview-publish-move";

interface MovePanelProps {
  channelId: string;
  entry: CalendarEntry;
  /** The day it was dropped on; null when opened from the keyboard, to pick a day first. */
  droppedOn: string | null;
  onClose: () => void;
}

function Consequences({ preview }: { preview: PublishMovePreview }) {
  return (
    <div className="flex flex-col gap-3">
      <h3 className="font-semibold">What moves with it ({preview.moved.length})</h3>
      <ul tabIndex={0} className="flex max-h-64 flex-col gap-1 overflow-y-auto text-sm" aria-label="What moves with it">
        {preview.moved.map((m) => (
          <li key={m.key} className="rounded-sm bg-ply-100 px-2 py-1">
            <span className="font-medium">{m.title}</span>{" "}
            <span className="text-graphite-500">({calendarKindLabels[m.kind]})</span>:{" "}
            {m.from ? formatDay(m.from) : "not dated"} → {m.to ? formatDay(m.to) : "no longer dated"}
          </li>
        ))}
      </ul>
      {preview.newConflicts.length > 0 && (
        <Notice kind="error">
          <p className="font-semibold">This move makes clashes:</p>
          <ul className="list-disc pl-5">
            {preview.newConflicts.map((m) => (
              <li key={m}>{m}</li>
            ))}
          </ul>
        </Notice>
      )}
    </div>
  );
}

/**
 * Moving a publish day: first what goes with it (stage due dates, sponsor items counted from it) and
 * any clash it makes, worked out by the server without saving; then the person says yes or keeps it.
 */
export function MovePanel({ channelId, entry, droppedOn, onClose }: MovePanelProps) {
  const dialog = useRef<HTMLDialogElement>(null);
  const [date, setDate] = useState(droppedOn ?? entry.day);
  const preview = usePreviewPublishMove(channelId);
  const move = useMovePublishDate(channelId);
  useEffect(() => {
    dialog.current?.showModal();
    if (droppedOn) preview.mutate({ episodeId: entry.episodeId!, date: droppedOn });
    // Asked once, for the day it was dropped on.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  const ask = () => preview.mutate({ episodeId: entry.episodeId!, date });
  const confirm = () => move.mutate({ episodeId: entry.episodeId!, version: entry.episodeVersion!, date }, { onSuccess: onClose });
  const shown = preview.data && preview.data.to === date ? preview.data : null;
  return (
    <dialog ref={dialog} onClose={onClose} aria-labelledby="move-title" className="m-auto w-[min(36rem,calc(100vw-1.5rem))] rounded-lg border border-ply-300 bg-ply-50 p-5 text-graphite-900 backdrop:bg-graphite-900/40">
      <h2 id="move-title" className="text-lg font-semibold">Move the publish day of “{entry.episodeTitle}”</h2>
      <p className="mt-1 text-sm text-graphite-500">Now {formatDay(entry.day)}. Nothing is saved until you say so.</p>
      <form
        className="mt-4 flex flex-wrap items-end gap-2"
        onSubmit={(event) => {
          event.preventDefault();
          ask();
        }}
      >
        <label className="flex flex-col text-sm font-medium">
          New publish day
          <input type="date" required value={date} onChange={(event) => setDate(event.target.value)} className="mt-1 rounded-md border border-ply-300 bg-white px-2 py-1.5" />
        </label>
        <Button tone="quiet" type="submit" busy={preview.isPending}>
          Show what moves
        </Button>
      </form>
      <div className="mt-4" aria-live="polite">
        {preview.isPending && <p role="status">Working out what moves…</p>}
        {preview.isError && <Notice kind="error">{explain(preview.error).title}. {explain(preview.error).text}</Notice>}
        {shown && <Consequences preview={shown} />}
        {move.isError && <Notice kind="error">The date was not moved. {explain(move.error).text}</Notice>}
      </div>
      <div className="mt-5 flex flex-wrap justify-end gap-2">
        <Button tone="quiet" onClick={() => dialog.current?.close()}>
          Keep {formatDay(entry.day)}
        </Button>
        <Button disabled={!shown} busy={move.isPending} onClick={confirm}>
          Move to {formatDay(date)}
        </Button>
      </div>
    </dialog>
  );
}
