import { Link } from "react-router-dom";
import { searchHitPath } from "@shared/search/hit-path";
import type { SearchAnswer, SearchHit, TextRun } from "@shared/search/schemas";
import { explain } from "../../../components/States";

interface ResultsProps {
  channelId: string;
  typed: string;
  results: { status: "pending" | "error" | "success"; data: SearchAnswer | undefined; error: unknown; isFetching: boolean };
  onOpen: () => void;
}

/** The finder's answer: a plain line of state for screen readers, then each kind's hits, best group first. */
export function SearchResults({ channelId, typed, results, onOpen }: ResultsProps) {
  const answer = results.data;
  const count = answer?.groups.reduce((n, g) => n + g.hits.length, 0) ?? 0;
  const state =
    results.status === "error"
      ? explain(results.error).text
      : !answer || (results.isFetching && answer.query !== typed)
        ? "Searching…"
        : count === 0
          ? `Nothing in this channel matches “${answer.query}”. Try fewer words, or another spelling.`
          : `${count === 1 ? "1 result" : `${count} results`} for “${answer.query}”`;
  return (
    <div className="max-h-[70vh] overflow-y-auto rounded-md border border-ply-300 bg-white p-2 text-graphite-900 shadow-xl">
      <p role="status" className={`px-2 py-1 text-sm ${results.status === "error" ? "text-alarm-600" : "text-graphite-700"}`}>
        {state}
      </p>
      {answer?.groups.map((group) => (
        <section key={group.kind} aria-labelledby={`found-${group.kind}`} className="mt-2">
          <h3 id={`found-${group.kind}`} className="px-2 text-xs font-bold tracking-wide text-graphite-500 uppercase">
            {group.label}
          </h3>
          <ul>
            {group.hits.map((hit) => (
              <li key={hit.id}>
                <Link
                  data-search-hit
                  to={searchHitPath(channelId, hit)}
                  onClick={onOpen}
                  className="block rounded-sm px-2 py-1.5 hover:bg-ply-100 focus:bg-ply-200 focus:outline-2 focus:outline-amber-cut"
                >
                  <span className="block font-medium break-words">
                    <Marked runs={hit.title.length ? hit.title : [{ text: fallbackTitle(hit), match: false }]} />
                    {placeOf(hit) && <span className="font-normal text-graphite-500"> · {placeOf(hit)}</span>}
                  </span>
                  {hit.snippet.length > 0 && (
                    <span className="block text-sm break-words whitespace-pre-line text-graphite-700">
                      <Marked runs={hit.snippet} />
                    </span>
                  )}
                </Link>
              </li>
            ))}
          </ul>
        </section>
      ))}
    </div>
  );
}

/** Matched words as <mark>, every run as text: what people wrote is never read as HTML. */
function Marked({ runs }: { runs: TextRun[] }) {
  return runs.map((run, i) =>
    run.match ? (
      <mark key={i} className="rounded-sm bg-amber-cut/60 px-0.5 text-graphite-900">
        {run.text}
      </mark>
    ) : (
      <span key={i}>{run.text}</span>
    ),
  );
}

function fallbackTitle(hit: SearchHit): string {
  if (hit.kind === "testPlan") return `Test plan of ${hit.episodeTitle ?? "an episode"}`;
  if (hit.kind === "comment") return `Comment on ${hit.episodeTitle ?? "an episode"}`;
  return "Untitled";
}

/** Where the record sits: its number or timecode, and its episode when the title doesn't already say it. */
function placeOf(hit: SearchHit): string {
  const parts: string[] = [];
  if (hit.kind === "benchRun" && hit.place.number) parts.push(`run ${hit.place.number}`);
  if (hit.kind === "buildEntry" && hit.place.number) parts.push(`iteration ${hit.place.number}`);
  if (hit.kind === "mark" && hit.place.at) parts.push(`at ${hit.place.at}`);
  const named = hit.kind === "testPlan" || hit.kind === "comment" || hit.kind === "episode";
  if (hit.episodeTitle && !named) parts.push(hit.episodeTitle);
  return parts.join(" · ");
}
