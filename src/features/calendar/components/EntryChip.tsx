import { useDraggable } from "@dnd-kit/core";
import { Link } from "react-router-dom";
import { calendarKindLabels, type CalendarEntry } from "@shared/calendar/entries";
import { formatInstant, formatMoney } from "../../../lib/format";
import { kindMark } from "./entry-look";

interface ChipProps {
  entry: CalendarEntry;
  conflicts: string[] | undefined;
  timeZone: string;
  /** Compact in the month grid: one line, the rest in the link's description. */
  compact?: boolean;
  onMove?: (entry: CalendarEntry) => void;
}

function timeOf(entry: CalendarEntry, timeZone: string) {
  return entry.at ? formatInstant(entry.at, timeZone).split(", ")[1] : null;
}

/** One thing on a day: a link to its place in Kerf, its clashes, and for a publish day a way to move it. */
export function EntryChip({ entry, conflicts, timeZone, compact = false, onMove }: ChipProps) {
  const movable = Boolean(onMove && entry.episodeVersion !== null);
  const { setNodeRef, listeners, attributes, isDragging } = useDraggable({ id: entry.key, data: { entry }, disabled: !movable });
  const clash = conflicts && conflicts.length > 0;
  const describedBy = `${entry.key}-about`;
  const time = timeOf(entry, timeZone);
  return (
    <div
      ref={setNodeRef}
      data-kind={entry.kind}
      className={`min-w-0 rounded-sm border border-l-4 bg-ply-50 px-1.5 py-1 text-xs ${kindMark[entry.kind].edge} ${clash ? "border-alarm-600 ring-1 ring-alarm-600" : "border-ply-300"} ${isDragging ? "opacity-50" : ""}`}
    >
      <div className="flex min-w-0 items-start gap-1">
        {movable && (
          <button
            type="button"
            {...listeners}
            {...attributes}
            aria-label={`Drag to move ${entry.title}`}
            className="hidden cursor-grab touch-none px-0.5 text-graphite-500 sm:inline"
            tabIndex={-1}
          >
            ⠿
          </button>
        )}
        <span aria-hidden className="shrink-0 text-graphite-500">
          {kindMark[entry.kind].glyph}
        </span>
        <Link to={entry.href} aria-describedby={describedBy} className={`min-w-0 font-medium text-graphite-900 underline-offset-2 hover:underline ${compact ? "truncate" : ""}`}>
          {time && <span className="mr-1 font-mono">{time}</span>}
          {entry.title}
        </Link>
        {clash && (
          <span className="ml-auto shrink-0 font-bold text-alarm-600" aria-hidden>
            !
          </span>
        )}
      </div>
      <div id={describedBy} className={compact ? "sr-only" : "mt-0.5 text-graphite-500"}>
        {calendarKindLabels[entry.kind]}. {entry.detail}
        {entry.fee && ` Fee ${formatMoney(entry.fee.amount, entry.fee.currency)}.`}
        {clash && <span className={compact ? "" : "block font-medium text-alarm-600"}> Clash: {conflicts.join(" ")}</span>}
      </div>
      {movable && !compact && (
        <button type="button" onClick={() => onMove!(entry)} className="mt-1 text-xs font-semibold text-rust-600 underline">
          Move publish day…
        </button>
      )}
      {movable && compact && (
        <button type="button" onClick={() => onMove!(entry)} className="sr-only focus:not-sr-only focus:text-xs focus:font-semibold focus:text-rust-600">
          Move publish day of {entry.episodeTitle}…
        </button>
      )}
    </div>
  );
}
