import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Me, SignUpInput } from "@shared/auth/schemas";
import { api } from "../../../lib/api-client";
import { browserTimeZone } from "../../../lib/format";
import { adoptSession } from "../../../lib/session";

export function useSignUp() {
  const queryClient = useQueryClient();
  return useMutation({
    // The new account starts in this browser's zone; the account page changes it.
    mutationFn: (input: SignUpInput) => api<Me>("/api/auth/sign-up", { method: "POST", body: { ...input, timeZone: browserTimeZone() } }),
    onSuccess: (me) => adoptSession(queryClient, me),
  });
}
