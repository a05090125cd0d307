import type { EntryView, NewEntryInput } from "@shared/economics/schemas";
import { api } from "../../../lib/api-client";
import { episodeMoneyBase } from "./keys";
import { useMoneyMutation } from "./money-mutation";

export const useAddEntry = (channelId: string, episodeId: string) =>
  useMoneyMutation(channelId, (input: NewEntryInput) => api<{ entry: EntryView }>(`${episodeMoneyBase(channelId, episodeId)}/entries`, { method: "POST", body: input }).then((r) => r.entry));
