import { useId, useState, type FormEvent } from "react";
import { useSearchParams } from "react-router-dom";
import { filterKeys, footageQuerySchema, footageSearchParams, footageSortLabels, type FootageSort } from "@shared/rushes/footage-query";
import type { ClipView } from "@shared/rushes/schemas";
import { clipRatingLabels, clipRatings, shotKindLabels, shotKinds } from "@shared/rushes/vocabulary";
import { Button } from "../../../components/Button";
import { Empty, QueryState } from "../../../components/States";
import { useEpisodeTitles } from "../api/list-episode-titles";
import { useFootage } from "../api/list-footage";
import { useShootDays } from "../api/list-shoot-days";
import { useShots } from "../api/list-shots";
import { ClipPanel } from "./ClipPanel";
import { ExportLinks } from "./ExportLinks";
import { formatDay, formatDuration, formatInstant, formatSize } from "../../../lib/format";
import { ClipMediaNote } from "./ClipMedia";
import { useTimeZone } from "../../../lib/session";

const input = "w-full min-w-0 rounded-md border border-ply-300 bg-white px-2 py-1.5 text-sm";

/** The editor's footage list: filters live in the URL, sorting and pages come from the server. */
export function FootageList({ channelId, episodeId, canDelete }: { channelId: string; episodeId?: string; canDelete: boolean }) {
  const [params, setParams] = useSearchParams();
  const parsed = footageQuerySchema.safeParse(Object.fromEntries(params));
  const q = parsed.success ? parsed.data : footageQuerySchema.parse({});
  const effective = { ...q, episodeId: episodeId ?? q.episodeId };
  const search = footageSearchParams({ ...effective, cursor: q.cursor }).toString();
  const listQuery = footageSearchParams({ ...effective }).toString();
  const footage = useFootage(channelId, search);
  const [history, setHistory] = useState<string[]>([]);
  const [selected, setSelected] = useState<Set<string>>(new Set());
  const openClip = params.get("clip");
  // A search hit on a mark opens its clip at the mark.
  const openMark = params.get("mark");

  const update = (changes: Record<string, string | undefined>) => {
    const next = new URLSearchParams(params);
    for (const [k, v] of Object.entries(changes)) {
      if (v === undefined || v === "") next.delete(k);
      else next.set(k, v);
    }
    if (!("cursor" in changes)) {
      next.delete("cursor");
      setHistory([]);
    }
    setParams(next, { replace: false });
  };

  const sortBy = (sort: FootageSort) => update({ sort, dir: q.sort === sort && q.dir === "desc" ? "asc" : "desc" });
  const toggle = (id: string) => setSelected((s) => (s.has(id) ? new Set([...s].filter((x) => x !== id)) : new Set([...s, id])));

  return (
    <div>
      <Filters channelId={channelId} episodeId={episodeId} values={q} onApply={update} />
      <QueryState query={footage} loading="Loading footage…">
        {(page) => (
          <>
            <div className="my-3 flex flex-wrap items-center justify-between gap-3">
              <p className="text-sm text-graphite-700" aria-live="polite" data-testid="footage-totals">
                <strong>{page.totals.clips}</strong> {page.totals.clips === 1 ? "clip" : "clips"} · {formatDuration(page.totals.durationMs)} running time · {formatSize(page.totals.bytes)}
              </p>
              <ExportLinks channelId={channelId} query={listQuery} selected={[...selected]} />
            </div>
            {page.clips.length === 0 ? (
              <Empty title="No footage matches">{params.toString() ? "Loosen a filter, or upload camera files." : "Upload camera files to see them here."}</Empty>
            ) : (
              <div className="overflow-x-auto rounded-lg border border-ply-300 bg-white">
                <table className="w-full text-left text-sm">
                  <caption className="sr-only">Footage, sorted by {footageSortLabels[q.sort]} {q.dir === "asc" ? "ascending" : "descending"}</caption>
                  <thead className="bg-ply-100 text-xs uppercase tracking-wide text-graphite-500">
                    <tr>
                      <th className="px-2 py-2">
                        <span className="sr-only">Select</span>
                      </th>
                      <th className="px-2 py-2">Poster</th>
                      <SortHeader label="File" sort="name" q={q} onSort={sortBy} />
                      <SortHeader label="Recorded" sort="recorded" q={q} onSort={sortBy} />
                      <SortHeader label="Duration" sort="duration" q={q} onSort={sortBy} />
                      <th className="px-2 py-2">Start TC</th>
                      <th className="px-2 py-2">Rating</th>
                      <th className="px-2 py-2">Shot</th>
                      <th className="px-2 py-2">Tags</th>
                      <th className="px-2 py-2">Marks</th>
                      <SortHeader label="Size" sort="size" q={q} onSort={sortBy} />
                    </tr>
                  </thead>
                  <tbody className="divide-y divide-ply-200">
                    {page.clips.map((clip) => (
                      <ClipRow key={clip.id} clip={clip} selected={selected.has(clip.id)} onToggle={() => toggle(clip.id)} onOpen={() => update({ clip: clip.id, cursor: q.cursor })} />
                    ))}
                  </tbody>
                </table>
              </div>
            )}
            {(history.length > 0 || page.nextCursor) && (
            <nav aria-label="Pages" className="mt-3 flex gap-2">
              <Button
                tone="quiet"
                disabled={history.length === 0}
                onClick={() => {
                  const previous = history.at(-1);
                  setHistory((h) => h.slice(0, -1));
                  update({ cursor: previous || undefined });
                }}
              >
                Previous page
              </Button>
              <Button
                tone="quiet"
                disabled={!page.nextCursor}
                onClick={() => {
                  setHistory((h) => [...h, q.cursor ?? ""]);
                  update({ cursor: page.nextCursor ?? undefined });
                }}
              >
                Next page
              </Button>
            </nav>
            )}
          </>
        )}
      </QueryState>
      {openClip && <ClipPanel channelId={channelId} clipId={openClip} markId={openMark} canDelete={canDelete} onClose={() => update({ clip: undefined, mark: undefined, cursor: q.cursor })} />}
    </div>
  );
}

function SortHeader({ label, sort, q, onSort }: { label: string; sort: FootageSort; q: { sort: FootageSort; dir: "asc" | "desc" }; onSort: (s: FootageSort) => void }) {
  const active = q.sort === sort;
  return (
    <th className="px-2 py-2" aria-sort={active ? (q.dir === "asc" ? "ascending" : "descending") : "none"}>
      <button type="button" className="font-semibold uppercase hover:text-graphite-900" onClick={() => onSort(sort)}>
        {label} {active ? (q.dir === "asc" ? "▲" : "▼") : ""}
      </button>
    </th>
  );
}

function ClipRow({ clip, selected, onToggle, onOpen }: { clip: ClipView; selected: boolean; onToggle: () => void; onOpen: () => void }) {
  const timeZone = useTimeZone();
  return (
    <tr className={selected ? "bg-ply-100" : undefined}>
      <td className="px-2 py-1.5">
        <input type="checkbox" checked={selected} onChange={onToggle} aria-label={`Select ${clip.fileName}`} />
      </td>
      <td className="px-2 py-1.5">
        {clip.posterUrl ? <img src={clip.posterUrl} alt="" className="h-10 w-16 rounded object-cover" /> : <div className="h-10 w-16 rounded bg-graphite-900/10" aria-hidden />}
      </td>
      <td className="px-2 py-1.5">
        <button type="button" onClick={onOpen} className="font-medium text-rust-700 underline-offset-2 hover:underline">
          {clip.fileName}
        </button>
        <p className="text-xs text-graphite-500">{clip.camera || clip.episodeTitle}</p>
        <ClipMediaNote clip={clip} />
      </td>
      <td className="px-2 py-1.5 whitespace-nowrap">{formatInstant(clip.recordedAt, timeZone)}</td>
      <td className="px-2 py-1.5 tabular-nums">{formatDuration(clip.durationMs)}</td>
      <td className="px-2 py-1.5 font-mono text-xs">{clip.startTimecode ?? "—"}</td>
      <td className="px-2 py-1.5">{clip.rating ? clipRatingLabels[clip.rating] : "—"}</td>
      <td className="px-2 py-1.5 text-xs">{clip.shotDescription ?? "—"}</td>
      <td className="px-2 py-1.5 text-xs">{clip.tags.join(", ") || "—"}</td>
      <td className="px-2 py-1.5 tabular-nums">{clip.markCount}</td>
      <td className="px-2 py-1.5 whitespace-nowrap tabular-nums">{formatSize(clip.size)}</td>
    </tr>
  );
}

type Values = Partial<Record<(typeof filterKeys)[number], string | undefined>>;

function Filters({ channelId, episodeId, values, onApply }: { channelId: string; episodeId?: string; values: Values; onApply: (v: Record<string, string | undefined>) => void }) {
  const episodes = useEpisodeTitles(channelId, !episodeId);
  const chosenEpisode = episodeId ?? values.episodeId;
  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const next: Record<string, string | undefined> = {};
    for (const key of filterKeys) {
      if (key === "episodeId" && episodeId) continue;
      const v = data.get(key);
      next[key] = typeof v === "string" && v.trim() ? v.trim() : undefined;
    }
    onApply(next);
  };
  const formKey = filterKeys.map((k) => values[k] ?? "").join("|");
  // On a phone the filters fold away under one button, so the clips come first.
  const [unfolded, setUnfolded] = useState(false);
  const set = filterKeys.filter((k) => values[k] && !(k === "episodeId" && episodeId)).length;
  const formId = useId();
  return (
    <>
      <button type="button" aria-expanded={unfolded} aria-controls={formId} onClick={() => setUnfolded((u) => !u)} className="mb-2 rounded-md border border-ply-300 bg-ply-50 px-3 py-2 text-sm font-semibold hover:bg-ply-200 sm:hidden">
        {unfolded ? "Hide the filters" : "Filters"}
        {set > 0 && ` (${set} set)`}
      </button>
      <form id={formId} key={formKey} onSubmit={submit} aria-label="Filter footage" className={`${unfolded ? "grid" : "hidden"} grid-cols-1 gap-2 rounded-lg border border-ply-300 bg-ply-50 p-3 sm:grid sm:grid-cols-4 lg:grid-cols-5`}>
        {!episodeId && (
          <Field label="Episode">
            <select name="episodeId" defaultValue={values.episodeId ?? ""} className={input}>
              <option value="">Every episode</option>
              {episodes.data?.map((e) => (
                <option key={e.id} value={e.id}>
                  {e.title}
                </option>
              ))}
            </select>
          </Field>
        )}
        {chosenEpisode && <EpisodeFilters channelId={channelId} episodeId={chosenEpisode} values={values} />}
        <Field label="Tag">
          <input name="tag" defaultValue={values.tag ?? ""} className={input} placeholder="e.g. wiring" />
        </Field>
        <Field label="Rating">
          <select name="rating" defaultValue={values.rating ?? ""} className={input}>
            <option value="">Any rating</option>
            {clipRatings.map((r) => (
              <option key={r} value={r}>
                {clipRatingLabels[r]}
              </option>
            ))}
            <option value="unrated">Not rated yet</option>
          </select>
        </Field>
        <Field label="Kind">
          <select name="kind" defaultValue={values.kind ?? ""} className={input}>
            <option value="">Any kind</option>
            {shotKinds.map((k) => (
              <option key={k} value={k}>
                {shotKindLabels[k]}
              </option>
            ))}
          </select>
        </Field>
        <Field label="Marks">
          <select name="hasMarks" defaultValue={values.hasMarks ?? ""} className={input}>
            <option value="">With or without</option>
            <option value="yes">Has marks</option>
            <option value="no">No marks yet</option>
          </select>
        </Field>
        <Field label="Camera">
          <input name="camera" defaultValue={values.camera ?? ""} className={input} placeholder="e.g. A cam" />
        </Field>
        <Field label="Text in notes">
          <input name="q" type="search" defaultValue={values.q ?? ""} className={input} placeholder="e.g. fails" />
        </Field>
        <div className="flex flex-wrap items-end gap-2">
          <Button type="submit">Apply filters</Button>
          <Button type="button" tone="quiet" onClick={() => onApply(Object.fromEntries(filterKeys.filter((k) => !(k === "episodeId" && episodeId)).map((k) => [k, undefined])))}>
            Clear
          </Button>
        </div>
      </form>
    </>
  );
}

function EpisodeFilters({ channelId, episodeId, values }: { channelId: string; episodeId: string; values: Values }) {
  const days = useShootDays(channelId, episodeId);
  const shots = useShots(channelId, episodeId);
  return (
    <>
      <Field label="Shoot day">
        <select name="shootDayId" defaultValue={values.shootDayId ?? ""} className={input}>
          <option value="">Any day</option>
          {days.data?.map((d) => (
            <option key={d.id} value={d.id}>
              {formatDay(d.day)} {d.place}
            </option>
          ))}
        </select>
      </Field>
      <Field label="Shot">
        <select name="shotId" defaultValue={values.shotId ?? ""} className={input}>
          <option value="">Any shot</option>
          {shots.data?.map((s) => (
            <option key={s.id} value={s.id}>
              {s.description}
            </option>
          ))}
        </select>
      </Field>
    </>
  );
}

function Field({ label, children }: { label: string; children: React.ReactNode }) {
  return (
    <label className="flex min-w-0 flex-col gap-1 text-xs font-medium text-graphite-700">
      {label}
      {children}
    </label>
  );
}
