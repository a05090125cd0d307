import type { HazardChange, HazardView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useUpdateHazard = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, ({ id, change }: { id: string; change: HazardChange }) =>
    api<{ hazard: HazardView }>(`${episodeBase(channelId, episodeId)}/test-plan/hazards/${id}`, { method: "PATCH", body: change }).then((r) => r.hazard),
  );
