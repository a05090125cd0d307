import type { EdlRatesView } from "@shared/rushes/exports/edl-rates";
import { edlUrl, useEdlRates } from "../api/edl-rates";
import { exportUrl, zipUrl } from "../api/export-footage";

const link = "rounded-md border border-ply-300 bg-ply-50 px-3 py-1.5 font-semibold hover:bg-ply-200";
const clipCount = (n: number) => `${n} ${n === 1 ? "clip" : "clips"}`;

/**
 * The footage list's downloads. An edit decision list holds one frame rate and Kerf never converts a clip's
 * timecode, so when the filter mixes rates the EDL comes as one list per rate, and this says so first.
 */
export function ExportLinks({ channelId, query, selected }: { channelId: string; query: string; selected: string[] }) {
  const rates = useEdlRates(channelId, query);
  return (
    <div className="flex flex-col items-end gap-2 text-sm">
      <div className="flex flex-wrap justify-end gap-2">
        <span className="self-center text-graphite-500">Export this filter:</span>
        <a className={link} href={exportUrl(channelId, "csv", query)} download>
          CSV
        </a>
        {rates.data?.rates.length === 0 ? (
          <span className="self-center text-graphite-500">No EDL: none of these clips has a frame rate</span>
        ) : (
          <a className={link} href={edlUrl(channelId, query)} download>
            {(rates.data?.rates.length ?? 0) > 1 ? "EDLs, one per rate (zip)" : "EDL (CMX 3600)"}
          </a>
        )}
        <a className={link} href={exportUrl(channelId, "otio", query)} download>
          OpenTimelineIO
        </a>
        {selected.length > 0 && (
          <a className="rounded-md bg-rust-600 px-3 py-1.5 font-semibold text-white hover:bg-rust-700" href={zipUrl(channelId, selected)} download>
            Download {selected.length} as zip
          </a>
        )}
      </div>
      {rates.data && <RatesNote channelId={channelId} query={query} view={rates.data} />}
    </div>
  );
}

function RatesNote({ channelId, query, view }: { channelId: string; query: string; view: EdlRatesView }) {
  const left = view.withoutRate > 0 ? ` ${clipCount(view.withoutRate)} without a frame rate stay out of every EDL.` : "";
  if (view.rates.length <= 1) {
    if (!left && view.rates.length === 1) return <p className="text-xs text-graphite-500">EDL timecode at {view.rates[0]!.label}, as the clips were shot.</p>;
    return left ? <p className="text-xs text-graphite-500">{left.trim()}</p> : null;
  }
  return (
    <div role="note" aria-label="Frame rates of this filter" className="max-w-xl rounded-md border border-amber-cut bg-ply-50 px-3 py-2 text-xs text-graphite-700">
      <p>
        These clips were shot at {view.rates.length} frame rates. An EDL holds one rate, and Kerf never converts a clip&apos;s timecode, so each rate
        gets its own list (the zip holds them all), or take one:{left}
      </p>
      <ul className="mt-1 flex flex-wrap gap-x-3 gap-y-1">
        {view.rates.map((r) => (
          <li key={r.rate}>
            <a className="font-semibold text-rust-700 underline underline-offset-2" href={edlUrl(channelId, query, r.rate)} download>
              EDL at {r.label}
            </a>{" "}
            ({clipCount(r.clips)})
          </li>
        ))}
      </ul>
    </div>
  );
}
