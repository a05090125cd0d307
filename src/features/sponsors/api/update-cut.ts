import type { Versioned } from "@shared/http/version";
import type { CutInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation, type DealAnswer } from "./sponsor-mutation";

export const useUpdateCut = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, (input: Versioned<CutInput>) => api<DealAnswer>(`${channelBase(channelId)}/deals/${dealId}/cut`, { method: "PUT", body: input }).then((r) => r.deal));
