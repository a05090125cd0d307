import type { MoneySettingsInput, SettingsView } from "@shared/economics/schemas";
import { api } from "../../../lib/api-client";
import { moneyBase } from "./keys";
import { useMoneyMutation } from "./money-mutation";

export const useSaveMoneySettings = (channelId: string) =>
  useMoneyMutation(channelId, (input: MoneySettingsInput) => api<{ settings: SettingsView }>(`${moneyBase(channelId)}/settings`, { method: "PUT", body: input }).then((r) => r.settings));
