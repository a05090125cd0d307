import type { ResultsCardView } from "@shared/bench/results-card-view";
import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

/** Asks the server to draw the card again from the bench as it is now. */
export const useRequestResultsCard = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, () => api<{ card: ResultsCardView }>(`${episodeBase(channelId, episodeId)}/results-card`, { method: "POST" }).then((r) => r.card));
