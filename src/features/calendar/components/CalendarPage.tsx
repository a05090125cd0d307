import { DndContext, PointerSensor, useSensor, useSensors, type Active, type Announcements, type DragEndEvent, type Over } from "@dnd-kit/core";
import { useMemo, useState } from "react";
import type { CalendarEntry } from "@shared/calendar/entries";
import { addDays, addMonths, monthGrid, monthTitle, weekDays } from "@shared/calendar/days";
import { localDate } from "@shared/slate/dates";
import { Button } from "../../../components/Button";
import { PageHeader } from "../../../components/PageHeader";
import { QueryState } from "../../../components/States";
import { formatDay } from "../../../lib/format";
import { useChannel, useTimeZone } from "../../../lib/session";
import { useCalendar } from "../api/get-calendar";
import { applyFilters, CalendarFilters, noFilters, type Filters } from "./CalendarFilters";
import { MovePanel } from "./MovePanel";
import { DayList, MonthGrid, WeekColumns, type DaysProps } from "./Views";

type View = "month" | "week" | "list";
const viewLabels: Record<View, string> = { month: "Month", week: "Week", list: "Days ahead" };
const LIST_DAYS = 42;

/** The phone opens on the list of days; a desk on the month. */
const firstView = (): View => (typeof window !== "undefined" && window.matchMedia?.("(max-width: 639px)").matches ? "list" : "month");

function daysOf(view: View, cursor: string): string[] {
  if (view === "month") return monthGrid(cursor);
  if (view === "week") return weekDays(cursor);
  return Array.from({ length: LIST_DAYS }, (_, i) => addDays(cursor, i));
}

function step(view: View, cursor: string, n: number): string {
  if (view === "month") return addMonths(cursor, n);
  return addDays(cursor, n * (view === "week" ? 7 : LIST_DAYS));
}

function titleOf(view: View, days: string[], cursor: string) {
  if (view === "month") return monthTitle(cursor);
  return `${formatDay(days[0])} – ${formatDay(days.at(-1))}`;
}

function groupByDay(entries: CalendarEntry[]) {
  const byDay = new Map<string, CalendarEntry[]>();
  for (const e of entries) byDay.set(e.day, [...(byDay.get(e.day) ?? []), e]);
  return byDay;
}

const entryOf = (active: Active) => active.data.current?.entry as CalendarEntry | undefined;
const dayOf = (over: Over | null) => over?.data.current?.day as string | undefined;
const nameOf = (active: Active) => entryOf(active)?.title ?? "The entry";

/** What a screen reader hears while a publish day is dragged: days in words, never the board's own ids. */
const announcements: Announcements = {
  onDragStart: ({ active }) => `Picked up ${nameOf(active)}, on ${formatDay(entryOf(active)?.day)}.`,
  onDragOver: ({ active, over }) => `${nameOf(active)} is over ${dayOf(over) ? formatDay(dayOf(over)) : "no day"}.`,
  onDragEnd: ({ active, over }) => (dayOf(over) ? `${nameOf(active)} let go on ${formatDay(dayOf(over))}.` : `${nameOf(active)} put back.`),
  onDragCancel: ({ active }) => `Move cancelled. ${nameOf(active)} stays on ${formatDay(entryOf(active)?.day)}.`,
};

/** The channel's calendar: publish days, release times, shoot days, sponsor items, stage due dates and figures days. */
export function CalendarPage() {
  const channel = useChannel();
  const timeZone = useTimeZone();
  const today = localDate(new Date(), timeZone);
  const [view, setView] = useState<View>(firstView);
  const [cursor, setCursor] = useState(today);
  const [filters, setFilters] = useState<Filters>(noFilters);
  const [moving, setMoving] = useState<{ entry: CalendarEntry; droppedOn: string | null } | null>(null);
  const days = useMemo(() => daysOf(view, cursor), [view, cursor]);
  const calendar = useCalendar(channel.channelId, days[0]!, days.at(-1)!);
  const sensors = useSensors(useSensor(PointerSensor, { activationConstraint: { distance: 6 } }));
  const onDragEnd = ({ active, over }: DragEndEvent) => {
    const entry = entryOf(active);
    const day = dayOf(over);
    if (entry && day && day !== entry.day) setMoving({ entry, droppedOn: day });
  };
  return (
    <div className="mx-auto flex max-w-6xl flex-col gap-4">
      <PageHeader title="Calendar" subtitle={`Times in ${timeZone}. Drag a publish day, or use “Move publish day”, to see what moves with it before saving.`} />
      <div className="flex flex-wrap items-center justify-between gap-2">
        <div role="group" aria-label="View" className="inline-flex rounded-md border border-ply-300 bg-ply-50 p-0.5">
          {(Object.keys(viewLabels) as View[]).map((v) => (
            <button key={v} type="button" aria-pressed={view === v} onClick={() => setView(v)} className={`rounded px-3 py-1.5 text-sm font-semibold ${view === v ? "bg-graphite-900 text-ply-50" : "text-graphite-700"}`}>
              {viewLabels[v]}
            </button>
          ))}
        </div>
        <div className="flex items-center gap-1">
          <Button tone="quiet" aria-label="Earlier" onClick={() => setCursor(step(view, cursor, -1))}>
            ‹
          </Button>
          <Button tone="quiet" onClick={() => setCursor(today)}>
            Today
          </Button>
          <Button tone="quiet" aria-label="Later" onClick={() => setCursor(step(view, cursor, 1))}>
            ›
          </Button>
        </div>
      </div>
      <h2 className="text-xl font-semibold" aria-live="polite">
        {titleOf(view, days, cursor)}
      </h2>
      <QueryState query={calendar} loading="Reading the calendar…" page>
        {(data) => {
          const shown = applyFilters(data.entries, filters);
          const props: DaysProps = { days, byDay: groupByDay(shown), conflicts: data.conflicts, today: data.today, timeZone, month: view === "month" ? cursor.slice(0, 7) : undefined, onMove: (entry) => setMoving({ entry, droppedOn: null }) };
          return (
            <div className="flex flex-col gap-4">
              <CalendarFilters entries={data.entries} members={data.members} filters={filters} onChange={setFilters} />
              <p className="text-sm text-graphite-500" role="status">
                {shown.length} on these days{Object.keys(data.conflicts).length > 0 && `, ${Object.keys(data.conflicts).length} with a clash (marked “!”)`}.
              </p>
              <DndContext sensors={sensors} onDragEnd={onDragEnd} accessibility={{ announcements }}>
                {view === "month" && <MonthGrid {...props} />}
                {view === "week" && <WeekColumns {...props} />}
                {view === "list" && <DayList {...props} />}
              </DndContext>
            </div>
          );
        }}
      </QueryState>
      {moving && <MovePanel channelId={channel.channelId} entry={moving.entry} droppedOn={moving.droppedOn} onClose={() => setMoving(null)} />}
    </div>
  );
}
