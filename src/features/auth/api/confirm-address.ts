import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { VerificationMailAnswer, VerifyEmailAnswer } from "@shared/auth/schemas";
import { api, rememberCsrfToken } from "../../../lib/api-client";
import { sessionKeys } from "../../../lib/session";

/** Opens a confirmation link; a signed-in person's `me` then says their address is confirmed. */
export function useVerifyEmail() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (token: string) => api<VerifyEmailAnswer>("/api/auth/verify-email", { method: "POST", body: { token } }),
    onSuccess: ({ me }) => {
      rememberCsrfToken(me.csrfToken);
      queryClient.setQueryData(sessionKeys.me(), me);
    },
  });
}

/** Another confirmation mail for the signed-in account (the server allows three an hour). */
export function useSendConfirmationMail() {
  return useMutation({ mutationFn: () => api<VerificationMailAnswer>("/api/auth/verification-mail", { method: "POST" }) });
}
