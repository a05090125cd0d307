import type { SponsorInput, SponsorSummary } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useCreateSponsor = (channelId: string) =>
  useSponsorMutation(channelId, (input: SponsorInput) =>
    api<{ sponsor: SponsorSummary }>(`${channelBase(channelId)}/sponsors`, { method: "POST", body: input }).then((r) => r.sponsor),
  );
