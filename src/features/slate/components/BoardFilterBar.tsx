import type { Board, BoardFilters } from "@shared/slate/schemas";
import type { SlatePerson } from "@shared/slate/schemas";

const selectClass = "rounded-md border border-ply-300 bg-white px-2 py-1.5 text-sm";

/** The board's filters; they live in the page's URL, so a link shows the same board. */
export function BoardFilterBar({ filters, onChange, people, board }: { filters: BoardFilters; onChange: (next: BoardFilters) => void; people: SlatePerson[]; board: Board | undefined }) {
  const set = (key: keyof BoardFilters, value: string | undefined) => onChange({ ...filters, [key]: value || undefined });
  const tags = board?.tags ?? [];
  const sponsors = board?.sponsorOptions ?? [];
  const active = Object.values(filters).some(Boolean);
  return (
    <form role="search" aria-label="Filter the board" className="mb-4 flex flex-wrap items-center gap-3 text-sm" onSubmit={(e) => e.preventDefault()}>
      <label className="flex items-center gap-2">
        <span className="text-graphite-700">Owner</span>
        <select className={selectClass} value={filters.owner ?? ""} onChange={(e) => set("owner", e.target.value)}>
          <option value="">Anyone</option>
          <option value="none">No owner</option>
          {people.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </select>
      </label>
      <label className="flex items-center gap-2">
        <span className="text-graphite-700">Tag</span>
        <select className={selectClass} value={filters.tag ?? ""} onChange={(e) => set("tag", e.target.value)}>
          <option value="">Any tag</option>
          {filters.tag && !tags.includes(filters.tag) && <option value={filters.tag}>{filters.tag}</option>}
          {tags.map((t) => (
            <option key={t} value={t}>
              {t}
            </option>
          ))}
        </select>
      </label>
      {(sponsors.length > 0 || filters.sponsor) && (
        <label className="flex items-center gap-2">
          <span className="text-graphite-700">Sponsor</span>
          <select className={selectClass} value={filters.sponsor ?? ""} onChange={(e) => set("sponsor", e.target.value)}>
            <option value="">Any or none</option>
            {filters.sponsor && !sponsors.some((s) => s.value === filters.sponsor) && <option value={filters.sponsor}>(unknown sponsor)</option>}
            {sponsors.map((s) => (
              <option key={s.value} value={s.value}>
                {s.label}
              </option>
            ))}
          </select>
        </label>
      )}
      <label className="flex items-center gap-2">
        <input type="checkbox" className="size-4 accent-rust-600" checked={filters.risk === "1"} onChange={(e) => set("risk", e.target.checked ? "1" : undefined)} />
        At risk only
      </label>
      <label className="flex items-center gap-2">
        <input type="checkbox" className="size-4 accent-rust-600" checked={filters.archived === "1"} onChange={(e) => set("archived", e.target.checked ? "1" : undefined)} />
        Show archived
      </label>
      {active && (
        <button type="button" className="text-rust-600 underline" onClick={() => onChange({})}>
          Clear filters
        </button>
      )}
    </form>
  );
}
