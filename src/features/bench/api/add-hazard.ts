import type { HazardInput, HazardView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useAddHazard = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, (input: HazardInput) =>
    api<{ hazard: HazardView }>(`${episodeBase(channelId, episodeId)}/test-plan/hazards`, { method: "POST", body: input }).then((r) => r.hazard),
  );
