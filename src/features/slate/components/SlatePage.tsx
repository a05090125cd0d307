import { useDeferredValue, useEffect, useState } from "react";
import { Link, useNavigate, useSearchParams } from "react-router-dom";
import { roleMay } from "@shared/access/roles";
import { boardFilterKeys, emptyEpisodeFields } from "@shared/slate/choices";
import type { BoardFilters } from "@shared/slate/schemas";
import { Button } from "../../../components/Button";
import { PageHeader } from "../../../components/PageHeader";
import { Empty, Loading, QueryState } from "../../../components/States";
import { useChannel } from "../../../lib/session";
import { useBoard } from "../api/get-board";
import { usePeople } from "../api/get-people";
import { useCreateEpisode } from "../api/create-episode";
import { Board } from "./Board";
import { BoardFilterBar } from "./BoardFilterBar";
import { Dialog } from "./Dialog";
import { EpisodeForm } from "./EpisodeFormLoader";
import { formatDay } from "../../../lib/format";

/** Every episode of the channel, one column per stage. */
export function SlatePage() {
  const channel = useChannel();
  const [filters, setFilters] = useBoardFilters();
  if (!filters) return <Loading label="Loading the slate…" page />;
  return (
    <Slate
      filters={filters}
      setFilters={setFilters}
      channelId={channel.channelId}
      channelName={channel.channelName}
      canMove={roleMay(channel.role, "episodes", "W")}
      canSeeSettings={roleMay(channel.role, "members", "R")}
    />
  );
}

type FiltersSchema = (typeof import("@shared/slate/schemas"))["boardFiltersSchema"];
let filtersSchema: FiltersSchema | undefined;
const loadFiltersSchema = async () => (filtersSchema ??= (await import("@shared/slate/schemas")).boardFiltersSchema);

/**
 * Filters as the URL holds them; anything malformed there is dropped rather than failing the page.
 * Their schema (and zod with it) is fetched only once the address has filters, or one is picked:
 * until it is there the filters of an address with some are undefined and the board waits.
 */
function useBoardFilters(): [BoardFilters | undefined, (next: BoardFilters) => void] {
  const [params, setParams] = useSearchParams();
  const [schema, setSchema] = useState(() => filtersSchema);
  const picked = Object.fromEntries(boardFilterKeys.flatMap((key) => (params.get(key) ? [[key, params.get(key)!]] : [])));
  const any = Object.keys(picked).length > 0;
  useEffect(() => {
    if (any && !schema) void loadFiltersSchema().then((loaded) => setSchema(() => loaded));
  }, [any, schema]);
  const parsed = any ? schema?.safeParse(picked) : undefined;
  const filters = !any ? {} : parsed && (parsed.success ? parsed.data : {});
  const setFilters = (next: BoardFilters) => {
    const out = new URLSearchParams();
    for (const key of boardFilterKeys) if (next[key]) out.set(key, next[key]!);
    // The schema first, so the page never waits for it with a filter in the address (and the focus stays put).
    void loadFiltersSchema().then((loaded) => {
      setSchema(() => loaded);
      setParams(out, { replace: true });
    });
  };
  return [filters, setFilters];
}

interface SlateProps {
  filters: BoardFilters;
  setFilters: (next: BoardFilters) => void;
  channelId: string;
  channelName: string;
  canMove: boolean;
  canSeeSettings: boolean;
}

function Slate({ filters, setFilters, channelId, channelName, canMove, canSeeSettings }: SlateProps) {
  const board = useBoard(channelId, filters);
  // The first paint of a big board renders in the background (React yields between cards), so the
  // page stays responsive; later changes (a drop) render at once from the live data.
  const firstPaint = useDeferredValue(board.data);
  const people = usePeople(channelId);
  const [creating, setCreating] = useState(false);
  const navigate = useNavigate();
  const create = useCreateEpisode(channelId);
  const filtered = Object.values(filters).some(Boolean);

  return (
    <div>
      <PageHeader
        title="Slate"
        subtitle={`${channelName}: every episode from challenge to publish.`}
        actions={
          <>
            {canSeeSettings && (
              <Link to={`/c/${channelId}/slate/schedule`} className="inline-flex items-center rounded-md border border-ply-300 bg-ply-50 px-4 py-2 text-sm font-semibold hover:bg-ply-200">
                Stage lengths
              </Link>
            )}
            {canMove && (
              <Button onClick={() => setCreating(true)} onPointerEnter={() => void EpisodeForm.preload()} onFocus={() => void EpisodeForm.preload()}>
                New episode
              </Button>
            )}
          </>
        }
      />
      <BoardFilterBar filters={filters} onChange={setFilters} people={people.data ?? []} board={board.data} />
      <QueryState query={board} loading="Loading the slate…" page>
        {(data) => (
          <>
            {data.episodes.length === 0 &&
              (filtered ? (
                <Empty title="No episodes match these filters">
                  <button type="button" className="text-rust-600 underline" onClick={() => setFilters({})}>
                    Clear filters
                  </button>
                </Empty>
              ) : (
                <Empty title="No episodes yet">{canMove ? "A challenge becomes an episode here: start with “New episode”." : "The owner starts episodes here."}</Empty>
              ))}
            <p className="mb-2 text-xs text-graphite-500">
              Due dates and days in stage as of {formatDay(data.today)}, in your time zone.
              {!canMove && " Your role reads the board; moving cards is for owners, producers and editors."}
            </p>
            {firstPaint ? <Board channelId={channelId} board={data} canMove={canMove} /> : <Loading label="Laying out the board…" page />}
          </>
        )}
      </QueryState>
      <Dialog open={creating} title="New episode" onClose={() => setCreating(false)} wide>
        <EpisodeForm
          channelId={channelId}
          initial={emptyEpisodeFields}
          submitLabel="Create episode"
          onCancel={() => setCreating(false)}
          onSubmit={async (fields) => {
            const episode = await create.mutateAsync(fields);
            setCreating(false);
            // The next step on a new episode is on its own page; the board shows it on the way back.
            await navigate(`/c/${channelId}/episodes/${episode.id}`, { state: { created: true } });
          }}
        />
      </Dialog>
    </div>
  );
}
