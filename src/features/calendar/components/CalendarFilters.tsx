import { calendarKindLabels, calendarKinds, type CalendarEntry, type CalendarMember } from "@shared/calendar/entries";
import { SelectField } from "../../../components/form-fields";

export interface Filters {
  kind: string;
  episode: string;
  sponsor: string;
  member: string;
}

export const noFilters: Filters = { kind: "", episode: "", sponsor: "", member: "" };

export function applyFilters(entries: CalendarEntry[], f: Filters): CalendarEntry[] {
  return entries.filter(
    (e) =>
      (!f.kind || e.kind === f.kind) &&
      (!f.episode || e.episodeId === f.episode) &&
      (!f.sponsor || e.sponsorId === f.sponsor) &&
      (!f.member || e.people.includes(f.member)),
  );
}

function choices(entries: CalendarEntry[], id: (e: CalendarEntry) => string | null, name: (e: CalendarEntry) => string | null) {
  const seen = new Map<string, string>();
  for (const e of entries) {
    const key = id(e);
    if (key && !seen.has(key)) seen.set(key, name(e) ?? key);
  }
  return [...seen].map(([value, label]) => ({ value, label })).sort((a, b) => a.label.localeCompare(b.label));
}

/** Narrow the days to one kind, episode, sponsor or member; the choices are what the days hold. */
export function CalendarFilters({ entries, members, filters, onChange }: { entries: CalendarEntry[]; members: CalendarMember[]; filters: Filters; onChange: (f: Filters) => void }) {
  const set = (key: keyof Filters) => (event: React.ChangeEvent<HTMLSelectElement>) => onChange({ ...filters, [key]: event.target.value });
  return (
    <fieldset className="grid grid-cols-2 gap-2 md:grid-cols-4">
      <legend className="sr-only">Show only</legend>
      <SelectField label="Kind" value={filters.kind} onChange={set("kind")} options={[{ value: "", label: "Every kind" }, ...calendarKinds.map((k) => ({ value: k, label: calendarKindLabels[k] }))]} />
      <SelectField label="Episode" value={filters.episode} onChange={set("episode")} options={[{ value: "", label: "Every episode" }, ...choices(entries, (e) => e.episodeId, (e) => e.episodeTitle)]} />
      <SelectField label="Sponsor" value={filters.sponsor} onChange={set("sponsor")} options={[{ value: "", label: "Every sponsor" }, ...choices(entries, (e) => e.sponsorId, (e) => e.sponsorName)]} />
      <SelectField label="Member" value={filters.member} onChange={set("member")} options={[{ value: "", label: "Everyone" }, ...members.map((m) => ({ value: m.id, label: m.name }))]} />
    </fieldset>
  );
}
