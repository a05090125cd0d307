import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Me, SignInInput } from "@shared/auth/schemas";
import { api } from "../../../lib/api-client";
import { adoptSession } from "../../../lib/session";

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => api<Me>("/api/auth/sign-in", { method: "POST", body: input }),
    onSuccess: (me) => adoptSession(queryClient, me),
  });
}
