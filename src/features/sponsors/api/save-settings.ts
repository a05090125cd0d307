import type { SettingsInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useSaveSettings = (channelId: string) =>
  useSponsorMutation(channelId, (input: SettingsInput) => api(`${channelBase(channelId)}/sponsor-settings`, { method: "PUT", body: input }));
