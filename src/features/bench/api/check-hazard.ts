import type { HazardCheck, HazardView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

/** A safety check at power-on: crew may record it, though the hazard list itself is not theirs. */
export const useCheckHazard = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, ({ id, checked }: { id: string } & HazardCheck) =>
    api<{ hazard: HazardView }>(`${episodeBase(channelId, episodeId)}/test-plan/hazards/${id}/check`, { method: "PUT", body: { checked } }).then((r) => r.hazard),
  );
