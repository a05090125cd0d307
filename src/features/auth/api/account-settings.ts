import { queryOptions, useQuery } from "@tanstack/react-query";
import type { AccountSettings } from "@shared/auth/account";
import { api } from "../../../lib/api-client";
import { accountKeys } from "./keys";

export const fetchAccountSettings = async () => (await api<{ account: AccountSettings }>("/api/account")).account;

export const accountSettingsQuery = () => queryOptions({ queryKey: accountKeys.settings(), queryFn: fetchAccountSettings });

export const useAccountSettings = () => useQuery(accountSettingsQuery());
