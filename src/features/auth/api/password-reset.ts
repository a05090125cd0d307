import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { PasswordResetInput, PasswordResetRequest, PasswordResetRequestAnswer } from "@shared/auth/account";
import type { Me } from "@shared/auth/schemas";
import { api } from "../../../lib/api-client";
import { adoptSession, meQueryOptions } from "../../../lib/session";

/** Asks for a "set a new password" mail; the answer is the same whether or not the address has an account. */
export function useRequestPasswordReset() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: PasswordResetRequest) => {
      // A page opened straight from a link has no CSRF token yet: `me` hands one out.
      await queryClient.ensureQueryData(meQueryOptions());
      return api<PasswordResetRequestAnswer>("/api/auth/password-reset", { method: "POST", body: input });
    },
  });
}

/** Sets the new password from the mailed link; the account is signed out everywhere, this browser too. */
export function useResetPassword() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: async (input: PasswordResetInput) => {
      await queryClient.ensureQueryData(meQueryOptions());
      return api<Me>("/api/auth/password-reset/complete", { method: "POST", body: input });
    },
    onSuccess: (me) => adoptSession(queryClient, me),
  });
}
