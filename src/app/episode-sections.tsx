import type { EpisodeSection } from "../lib/episode-sections";
import { BenchSection } from "../features/bench/components/BenchSection";
import { BuildLogSection } from "../features/bench/components/BuildLogSection";
import { TestPlanSheet } from "../features/bench/components/TestPlanSheet";
import { PublishSection } from "../features/publish/components/PublishSection";
import { EpisodeRushes } from "../features/rushes/components/EpisodeRushes";
import { EpisodeDeals } from "../features/sponsors/components/EpisodeDeals";

/**
 * The sections features add to the episode page, in the order of the episode's path. The slate's
 * own sections (overview, schedule, history) come first; each feature adds one line here.
 */
export const episodeSections: EpisodeSection[] = [
  { id: "test-plan", title: "Test plan", Component: TestPlanSheet },
  { id: "bench", title: "Bench runs", Component: BenchSection },
  { id: "build-log", title: "Build log", Component: BuildLogSection },
  { id: "shoot-footage", title: "Shoot and footage", Component: EpisodeRushes },
  { id: "sponsor-deals", title: "Sponsor deals", Component: EpisodeDeals },
  { id: "publish-package", title: "Publish package", Component: PublishSection },
];
