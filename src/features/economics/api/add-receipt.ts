import type { ReceiptView } from "@shared/economics/schemas";
import { sendFile } from "../../../lib/send-file";
import { episodeMoneyBase } from "./keys";
import { useMoneyMutation } from "./money-mutation";

export const useAddReceipt = (channelId: string, episodeId: string) =>
  useMoneyMutation(channelId, ({ entryId, file }: { entryId: string; file: File }) => sendFile<ReceiptView>(`${episodeMoneyBase(channelId, episodeId)}/entries/${entryId}/receipt`, file, "receipt"));
