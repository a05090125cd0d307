import { useState } from "react";
import { feedScopeLabels, feedScopes, type FeedScope, type FeedSummary, type NewFeed } from "@shared/calendar/feeds";
import { AskFirst } from "../../../components/AskFirst";
import { Button } from "../../../components/Button";
import { Notice } from "../../../components/Notice";
import { QueryState, explain } from "../../../components/States";
import { formatInstant } from "../../../lib/format";
import { useTimeZone } from "../../../lib/session";
import { useEndFeed } from "../api/end-feed";
import { useFeeds } from "../api/list-feeds";
import { useMakeFeed } from "../api/make-feed";

function FeedRow({ feed }: { feed: FeedSummary }) {
  const timeZone = useTimeZone();
  const [scope, setScope] = useState<FeedScope>(feed.scope ?? "everything");
  const [made, setMade] = useState<NewFeed | null>(null);
  const make = useMakeFeed();
  const end = useEndFeed();
  const name = `scope-${feed.channelId}`;
  return (
    <li className="flex flex-col gap-2 rounded-md border border-ply-300 bg-white p-3">
      <h3 className="font-semibold">{feed.channelName}</h3>
      <p className="text-sm text-graphite-500">
        {feed.createdAt ? `Feed on since ${formatInstant(feed.createdAt, timeZone)}: ${feedScopeLabels[feed.scope!].toLowerCase()}.` : "No feed for this channel."}
      </p>
      <fieldset className="flex flex-col gap-1 text-sm">
        <legend className="font-medium">What it holds</legend>
        {feedScopes.map((s) => (
          <label key={s} className="flex items-start gap-2">
            <input type="radio" name={name} value={s} checked={scope === s} onChange={() => setScope(s)} className="mt-1" />
            {feedScopeLabels[s]}
          </label>
        ))}
      </fieldset>
      <div className="flex flex-wrap gap-2">
        <Button busy={make.isPending} onClick={() => make.mutate({ channelId: feed.channelId, scope }, { onSuccess: setMade })}>
          {feed.createdAt ? "Make a new address" : "Make my feed address"}
        </Button>
        {feed.createdAt && (
          <AskFirst label="Turn the feed off" question="Calendar apps using it stop updating." yes="Turn it off" busy={end.isPending} onYes={() => end.mutate({ channelId: feed.channelId }, { onSuccess: () => setMade(null) })} />
        )}
      </div>
      {made && (
        <Notice kind="success">
          <p>Add this address to your calendar app as a subscription. It is shown only now; keep it private, as anyone with it sees these dates. A new address stops the old one.</p>
          <input readOnly aria-label={`Feed address for ${feed.channelName}`} value={made.url} onFocus={(event) => event.target.select()} className="mt-2 w-full rounded border border-ply-300 bg-white px-2 py-1 font-mono text-xs text-graphite-900" />
        </Notice>
      )}
      {(make.isError || end.isError) && <Notice kind="error">{explain(make.error ?? end.error).text}</Notice>}
    </li>
  );
}

/** Each channel's private calendar address for the signed-in member: made, remade or turned off here. */
export function CalendarFeeds() {
  const feeds = useFeeds();
  return (
    <section className="mx-auto mt-8 max-w-3xl" aria-labelledby="feeds-title">
      <h2 id="feeds-title" className="text-lg font-semibold">
        Calendar feeds
      </h2>
      <p className="mb-3 text-sm text-graphite-500">A private address per channel that calendar apps subscribe to: publish days, shoot days and sponsor items, updated as they change.</p>
      <QueryState query={feeds} loading="Reading your feeds…">
        {(list) =>
          list.length === 0 ? (
            <p className="text-sm text-graphite-500">You are not a member of any channel yet.</p>
          ) : (
            <ul className="flex flex-col gap-3">
              {list.map((feed) => (
                <FeedRow key={feed.channelId} feed={feed} />
              ))}
            </ul>
          )
        }
      </QueryState>
    </section>
  );
}
