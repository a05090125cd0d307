import { lazy, type ComponentType } from "react";
import type { EpisodeSection, EpisodeSectionProps } from "../lib/episode-sections";
import { testPlanQueryOptions } from "../features/bench/api/get-test-plan";
import { runsQueryOptions } from "../features/bench/api/list-runs";
import { partsQueryOptions } from "../features/bench/api/list-parts";
import { episodeDealsQueryOptions } from "../features/sponsors/api/episode-deals";
import { packageQueryOptions } from "../features/publish/api/get-package";

/** A part's code is fetched when it is first opened (or named in the address: `preload`), not with the page. */
function lazyPart<M>(load: () => Promise<M>, pick: (module: M) => ComponentType<EpisodeSectionProps>): Pick<EpisodeSection, "Component" | "preload"> {
  return { Component: lazy(async () => ({ default: pick(await load()) })), preload: load };
}

/**
 * The parts features add to the episode page, in the order of the episode's path; each id is the
 * part's name in the page's address. The slate's own parts (overview, dates) come first and its
 * history and comments last; each feature adds one line here.
 */
export const episodeSections: EpisodeSection[] = [
  {
    id: "test-plan",
    title: "Test plan",
    ...lazyPart(() => import("../features/bench/components/TestPlanSheet"), (m) => m.TestPlanSheet),
    prefetch: (client, { channelId, episodeId }) => void client.prefetchQuery(testPlanQueryOptions(channelId, episodeId)),
  },
  {
    id: "bench",
    title: "Bench runs",
    ...lazyPart(() => import("../features/bench/components/BenchSection"), (m) => m.BenchSection),
    prefetch: (client, { channelId, episodeId }) => {
      void client.prefetchQuery(runsQueryOptions(channelId, episodeId));
      void client.prefetchQuery(testPlanQueryOptions(channelId, episodeId));
      void client.prefetchQuery(partsQueryOptions(channelId));
    },
  },
  { id: "build-log", title: "Build log", ...lazyPart(() => import("../features/bench/components/BuildLogSection"), (m) => m.BuildLogSection) },
  { id: "shoot", title: "Shoot days and shots", ...lazyPart(() => import("../features/rushes/components/EpisodeRushes"), (m) => m.EpisodeShoot) },
  { id: "footage", title: "Footage", ...lazyPart(() => import("../features/rushes/components/EpisodeRushes"), (m) => m.EpisodeFootage) },
  {
    id: "sponsor-deals",
    title: "Sponsor deals",
    ...lazyPart(() => import("../features/sponsors/components/EpisodeDeals"), (m) => m.EpisodeDeals),
    prefetch: (client, { channelId, episodeId }) => void client.prefetchQuery(episodeDealsQueryOptions(channelId, episodeId)),
  },
  {
    id: "publish-package",
    title: "Publish package",
    ...lazyPart(() => import("../features/publish/components/PublishSection"), (m) => m.PublishSection),
    prefetch: (client, { channelId, episodeId }) => void client.prefetchQuery(packageQueryOptions(channelId, episodeId)),
  },
  { id: "money", title: "Costs and income", ...lazyPart(() => import("../features/economics/components/EpisodeMoney"), (m) => m.EpisodeMoney), area: "money" },
];
