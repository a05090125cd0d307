import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Me } from "@shared/auth/schemas";
import { api } from "../../../lib/api-client";
import { adoptSession } from "../../../lib/session";

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api<Me>("/api/auth/sign-out", { method: "POST" }),
    onSuccess: (me) => adoptSession(queryClient, me),
  });
}
