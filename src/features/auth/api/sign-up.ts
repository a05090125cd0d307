import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Me, SignUpInput } from "@shared/auth/schemas";
import { api } from "../../../lib/api-client";
import { adoptSession } from "../../../lib/session";

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignUpInput) => api<Me>("/api/auth/sign-up", { method: "POST", body: input }),
    onSuccess: (me) => adoptSession(queryClient, me),
  });
}
