import { queryOptions, useQuery } from "@tanstack/react-query";
import type { AccountSessions, SignedOutAnswer } from "@shared/auth/account";
import { api } from "../../../lib/api-client";
import { useAccountMutation } from "./account-mutation";
import { accountKeys } from "./keys";

export const fetchAccountSessions = () => api<AccountSessions>("/api/account/sessions");

export const accountSessionsQuery = () => queryOptions({ queryKey: accountKeys.sessions(), queryFn: fetchAccountSessions });

export const useAccountSessions = () => useQuery(accountSessionsQuery());

export const signOutOthers = () => api<SignedOutAnswer>("/api/account/sessions/sign-out-others", { method: "POST" });

export const useSignOutOthers = () => useAccountMutation<void, SignedOutAnswer>(signOutOthers);
