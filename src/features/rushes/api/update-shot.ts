import type { ShotInput } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { shootBase, useShootMutation } from "./shoot-mutation";

export const useUpdateShot = (channelId: string, episodeId: string) =>
  useShootMutation(channelId, episodeId, ({ id, ...patch }: { id: string } & Partial<ShotInput>) => api(`${shootBase(channelId)}/shots/${id}`, { method: "PATCH", body: patch }));
