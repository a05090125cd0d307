import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { StageLengths } from "@shared/slate/schedule";
import { api } from "../../../lib/api-client";
import { stageLengthsPath, type StageLengthSettings } from "./get-stage-lengths";
import { slateKeys } from "./keys";

/** New lengths move every due date: the boards and episode pages refetch. */
export function useSaveStageLengths(channelId: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (stageLengths: StageLengths) => api<StageLengthSettings>(stageLengthsPath(channelId), { method: "PUT", body: { stageLengths } }),
    onSuccess: (saved) => queryClient.setQueryData(slateKeys.settings(channelId), saved),
    onSettled: () => queryClient.invalidateQueries({ queryKey: slateKeys.channel(channelId) }),
  });
}
