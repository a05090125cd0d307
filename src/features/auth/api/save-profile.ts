import type { AccountSettings, ProfileInput } from "@shared/auth/account";
import { api } from "../../../lib/api-client";
import { useAccountMutation } from "./account-mutation";

export const saveProfile = async (input: ProfileInput) => (await api<{ account: AccountSettings }>("/api/account", { method: "PUT", body: input })).account;

export const useSaveProfile = () => useAccountMutation(saveProfile, (account: AccountSettings) => account);
