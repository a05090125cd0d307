import { Link, useParams } from "react-router-dom";
import { shotKindLabels, shotPriorityLabels, shotStatusLabels } from "@shared/rushes/vocabulary";
import { PageHeader } from "../../../components/PageHeader";
import { Empty, QueryState } from "../../../components/States";
import { formatDay } from "../../../lib/format";
import { useChannel } from "../../../lib/session";
import { useShootDay, type ShootDayDetail } from "../api/get-shoot-day";

/** The crew's view of one day: what is still missing before the set is struck, biggest first. */
export function ShootDayPage() {
  const channel = useChannel();
  const { shootDayId = "" } = useParams();
  return <ShootDay channelId={channel.channelId} shootDayId={shootDayId} />;
}

function ShootDay({ channelId, shootDayId }: { channelId: string; shootDayId: string }) {
  const day = useShootDay(channelId, shootDayId);
  return (
    <QueryState query={day} loading="Loading the shoot day…" page back={{ to: `/c/${channelId}/rushes`, label: "Rushes" }}>
      {(detail) => <ShootDaySheet channelId={channelId} detail={detail} />}
    </QueryState>
  );
}

function ShootDaySheet({ channelId, detail: { shootDay, shots, missing, episodeTitle } }: { channelId: string; detail: ShootDayDetail }) {
  const done = shots.filter((s) => s.status !== "planned");
  return (
    <article className="mx-auto max-w-3xl">
      <Link to={`/c/${channelId}/episodes/${shootDay.episodeId}`} className="text-sm text-rust-600 underline">
        ← {episodeTitle}
      </Link>
      <PageHeader
        title={`Shoot day ${formatDay(shootDay.day)}`}
        subtitle={`${shootDay.place || "Place not set"} · ${shootDay.callTime ? `call ${shootDay.callTime}` : "no call time"} · ${shootDay.crew.map((c) => c.name).join(", ") || "no crew named"}`}
      />
      <section aria-labelledby="missing-heading" className="mb-8">
        <h2 id="missing-heading" className="mb-3 text-lg font-semibold">
          Still to get ({missing.length})
        </h2>
        {missing.length === 0 ? (
          <Empty title="Nothing missing">Every planned shot of this day has footage or was dropped.</Empty>
        ) : (
          <ol className="flex flex-col gap-2">
            {missing.map((shot) => (
              <li key={shot.id} className={`rounded-md border-l-4 bg-white p-3 shadow-sm ${shot.priority === "must" ? "border-alarm-600" : "border-amber-cut"}`}>
                <p className="font-semibold">{shot.description}</p>
                <p className="text-xs text-graphite-500">
                  {shotKindLabels[shot.kind]} · {shotPriorityLabels[shot.priority]}
                </p>
              </li>
            ))}
          </ol>
        )}
      </section>
      <section aria-labelledby="done-heading">
        <h2 id="done-heading" className="mb-3 text-lg font-semibold">
          Captured or dropped ({done.length})
        </h2>
        <ul className="divide-y divide-ply-200 rounded-lg border border-ply-300 bg-white text-sm">
          {done.map((shot) => (
            <li key={shot.id} className="flex justify-between gap-3 px-4 py-2">
              <span>{shot.description}</span>
              <span className="text-graphite-500">
                {shotStatusLabels[shot.status]} · {shot.clipCount} {shot.clipCount === 1 ? "clip" : "clips"}
              </span>
            </li>
          ))}
        </ul>
      </section>
    </article>
  );
}
