import { lazy, Suspense } from "react";
import { roleMay } from "@shared/access/roles";
import { Loading } from "../../../components/States";
import type { EpisodeSectionProps } from "../../../lib/episode-sections";
import { FootageList } from "./FootageList";
import { ShootPlan } from "./ShootPlan";

// The uploader (and the metadata reader it loads when a file is chosen) is fetched only for those who may upload.
const Uploader = lazy(() => import("./Uploader").then((m) => ({ default: m.Uploader })));

/** The episode page's shoot section: the shoot days and the shot list. */
export function EpisodeShoot({ channelId, episodeId, role }: EpisodeSectionProps) {
  if (!roleMay(role, "shoot", "R")) return null;
  return <ShootPlan channelId={channelId} episodeId={episodeId} />;
}

/** The episode page's footage section: the uploads and this episode's footage. */
export function EpisodeFootage({ channelId, episodeId, role }: EpisodeSectionProps) {
  return (
    <div className="grid grid-cols-[minmax(0,1fr)] gap-6">
      {roleMay(role, "footage", "W") && (
        <Suspense fallback={<Loading label="Loading the uploader…" />}>
          <Uploader channelId={channelId} episodeId={episodeId} />
        </Suspense>
      )}
      {roleMay(role, "footage", "R") && (
        <section aria-labelledby="episode-footage-heading">
          <h3 id="episode-footage-heading" className="mb-2 font-semibold">
            This episode's footage
          </h3>
          <FootageList channelId={channelId} episodeId={episodeId} canDelete={roleMay(role, "footage", "W") && role !== "crew"} />
        </section>
      )}
    </div>
  );
}
