import type { EpisodeSection } from "../lib/episode-sections";
import { BenchSection } from "../features/bench/components/BenchSection";
import { BuildLogSection } from "../features/bench/components/BuildLogSection";
import { TestPlanSheet } from "../features/bench/components/TestPlanSheet";
import { EpisodeFootage, EpisodeShoot } from "../features/rushes/components/EpisodeRushes";
import { PublishSection } from "../features/publish/components/PublishSection";
import { EpisodeDeals } from "../features/sponsors/components/EpisodeDeals";
import { EpisodeMoney } from "../features/economics/components/EpisodeMoney";

/**
 * The parts features add to the episode page, in the order of the episode's path; each id is the
 * part's name in the page's address. The slate's own parts (overview, dates) come first and its
 * history and comments last; each feature adds one line here.
 */
export const episodeSections: EpisodeSection[] = [
  { id: "test-plan", title: "Test plan", Component: TestPlanSheet },
  { id: "bench", title: "Bench runs", Component: BenchSection },
  { id: "build-log", title: "Build log", Component: BuildLogSection },
  { id: "shoot", title: "Shoot days and shots", Component: EpisodeShoot },
  { id: "footage", title: "Footage", Component: EpisodeFootage },
  { id: "sponsor-deals", title: "Sponsor deals", Component: EpisodeDeals },
  { id: "publish-package", title: "Publish package", Component: PublishSection },
  { id: "money", title: "Costs and income", Component: EpisodeMoney, area: "money" },
];
