import { useDroppable } from "@dnd-kit/core";
import type { CalendarEntry } from "@shared/calendar/entries";
import { formatDay } from "../../../lib/format";
import { EntryChip } from "./EntryChip";

export interface DaysProps {
  days: string[];
  byDay: Map<string, CalendarEntry[]>;
  conflicts: Record<string, string[]>;
  today: string;
  timeZone: string;
  /** The month shown, "YYYY-MM": days of other months are dimmed. */
  month?: string;
  onMove?: (entry: CalendarEntry) => void;
}

const weekdayHeads = ["Mon", "Tue", "Wed", "Thu", "Fri", "Sat", "Sun"];

function DayCell({ day, props, compact }: { day: string; props: DaysProps; compact: boolean }) {
  const { setNodeRef, isOver } = useDroppable({ id: `day:${day}`, data: { day } });
  const entries = props.byDay.get(day) ?? [];
  const outside = props.month && !day.startsWith(props.month);
  const isToday = day === props.today;
  return (
    <li
      ref={setNodeRef}
      data-day={day}
      aria-label={`${formatDay(day)}${isToday ? ", today" : ""}: ${entries.length === 0 ? "nothing" : `${entries.length} on the calendar`}`}
      className={`flex min-h-20 min-w-0 flex-col gap-1 border-t border-ply-300 p-1 ${outside ? "bg-ply-100/60 text-graphite-500" : "bg-white"} ${isOver ? "outline-2 outline-amber-cut" : ""}`}
    >
      <span className={`self-start rounded-sm px-1 text-xs font-semibold ${isToday ? "bg-graphite-900 text-ply-50" : ""}`} aria-hidden>
        {compact ? Number(day.slice(8)) : formatDay(day, { withYear: false })}
      </span>
      {entries.map((entry) => (
        <EntryChip key={entry.key} entry={entry} conflicts={props.conflicts[entry.key]} timeZone={props.timeZone} compact={compact} onMove={props.onMove} />
      ))}
    </li>
  );
}

/** Six Monday-first weeks; on a phone each cell keeps its day number and one-line entries. */
export function MonthGrid(props: DaysProps) {
  return (
    <div className="overflow-hidden rounded-md border border-ply-300">
      <div className="grid grid-cols-7 bg-ply-200 text-center text-xs font-semibold text-graphite-700" aria-hidden>
        {weekdayHeads.map((d) => (
          <span key={d} className="py-1">
            {d}
          </span>
        ))}
      </div>
      <ol className="grid grid-cols-7 gap-px bg-ply-300" aria-label="Days of the month">
        {props.days.map((day) => (
          <DayCell key={day} day={day} props={props} compact />
        ))}
      </ol>
    </div>
  );
}

/** Seven days side by side on a desk, one under another on a phone, each entry in full. */
export function WeekColumns(props: DaysProps) {
  return (
    <ol className="grid grid-cols-1 gap-px overflow-hidden rounded-md border border-ply-300 bg-ply-300 md:grid-cols-7" aria-label="Days of the week">
      {props.days.map((day) => (
        <DayCell key={day} day={day} props={props} compact={false} />
      ))}
    </ol>
  );
}

/** Only the days with something on them, in order: the phone's first view. */
export function DayList(props: DaysProps) {
  const busy = props.days.filter((day) => (props.byDay.get(day) ?? []).length > 0);
  if (busy.length === 0) return <p className="rounded-md border border-dashed border-ply-300 p-6 text-center text-sm text-graphite-500">Nothing on these days with these filters.</p>;
  return (
    <ol className="flex flex-col gap-4" aria-label="Days with something on them">
      {busy.map((day) => (
        <li key={day}>
          <h3 className={`mb-1 text-sm font-semibold ${day === props.today ? "text-rust-600" : ""}`}>
            {formatDay(day)}
            {day === props.today && " · today"}
          </h3>
          <div className="flex flex-col gap-1.5">
            {props.byDay.get(day)!.map((entry) => (
              <EntryChip key={entry.key} entry={entry} conflicts={props.conflicts[entry.key]} timeZone={props.timeZone} onMove={props.onMove} />
            ))}
          </div>
        </li>
      ))}
    </ol>
  );
}
