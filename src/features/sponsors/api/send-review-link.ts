import type { ReviewLinkView, SendReviewInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useSendReviewLink = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, (input: SendReviewInput) =>
    api<{ link: ReviewLinkView; url: string }>(`${channelBase(channelId)}/deals/${dealId}/review-links`, { method: "POST", body: input }),
  );
