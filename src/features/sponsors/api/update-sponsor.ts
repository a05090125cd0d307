import type { Versioned } from "@shared/http/version";
import type { SponsorInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useUpdateSponsor = (channelId: string, sponsorId: string) =>
  useSponsorMutation(channelId, (input: Versioned<SponsorInput>) => api(`${channelBase(channelId)}/sponsors/${sponsorId}`, { method: "PATCH", body: input }));
