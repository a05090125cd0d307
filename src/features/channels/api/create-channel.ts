import { useMutation, useQueryClient } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { sessionKeys } from "../../../lib/session";

export function useCreateChannel() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: { name: string }) => api<{ id: string; name: string }>("/api/channels", { method: "POST", body: input }),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: sessionKeys.me() }),
  });
}
