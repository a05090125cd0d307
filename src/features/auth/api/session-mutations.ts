import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Me, SignInInput, SignUpInput } from "@shared/auth/schemas";
import { api } from "../../../lib/api-client";
import { adoptSession } from "../../../lib/session";

export function useSignIn() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignInInput) => api<Me>("/api/auth/sign-in", { method: "POST", body: input }),
    onSuccess: (me) => adoptSession(queryClient, me),
  });
}

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: SignUpInput) => api<Me>("/api/auth/sign-up", { method: "POST", body: input }),
    onSuccess: (me) => adoptSession(queryClient, me),
  });
}

export function useSignOut() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: () => api<Me>("/api/auth/sign-out", { method: "POST" }),
    onSuccess: (me) => adoptSession(queryClient, me),
  });
}
