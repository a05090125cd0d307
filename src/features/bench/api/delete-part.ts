import { api } from "../../../lib/api-client";
import { partsBase, useBenchMutation } from "./bench-mutation";

export const useDeletePart = (channelId: string) => useBenchMutation(channelId, (id: string) => api<void>(`${partsBase(channelId)}/${id}`, { method: "DELETE" }));
