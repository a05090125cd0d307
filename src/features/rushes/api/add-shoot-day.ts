import type { ShootDayInput } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { shootBase, useShootMutation } from "./shoot-mutation";

export const useCreateShootDay = (channelId: string, episodeId: string) =>
  useShootMutation(channelId, episodeId, (input: ShootDayInput) => api(`${shootBase(channelId)}/episodes/${episodeId}/shoot-days`, { method: "POST", body: input }));
