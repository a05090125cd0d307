import type { ShotInput } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { shootBase, useShootMutation } from "./shoot-mutation";

export const useCreateShot = (channelId: string, episodeId: string) =>
  useShootMutation(channelId, episodeId, (input: ShotInput) => api(`${shootBase(channelId)}/episodes/${episodeId}/shots`, { method: "POST", body: input }));
