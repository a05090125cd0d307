import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useSaveSpeakingRate = (channelId: string) =>
  useSponsorMutation(channelId, ({ userId, wordsPerMinute }: { userId: string; wordsPerMinute: number }) =>
    api(`${channelBase(channelId)}/speaking-rates/${userId}`, { method: "PUT", body: { wordsPerMinute } }),
  );
