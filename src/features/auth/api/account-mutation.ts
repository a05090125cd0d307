import { useMutation, useQueryClient, type MutationFunction } from "@tanstack/react-query";
import type { AccountSettings } from "@shared/auth/account";
import { sessionKeys } from "../../../lib/session";
import { accountKeys } from "./keys";

/**
 * Every write on the account page: its settings and sessions are read again, and so is `me` (the
 * name in the top bar, the zone every time is shown in). An answer carrying the account lands at once.
 */
export function useAccountMutation<TInput, TAnswer>(mutationFn: MutationFunction<TAnswer, TInput>, settingsOf?: (answer: TAnswer) => AccountSettings) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn,
    onSuccess: (answer) => {
      if (settingsOf) queryClient.setQueryData(accountKeys.settings(), settingsOf(answer));
    },
    onSettled: () => Promise.all([queryClient.invalidateQueries({ queryKey: accountKeys.all }), queryClient.invalidateQueries({ queryKey: sessionKeys.all })]),
  });
}
