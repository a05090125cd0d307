import type { Versioned } from "@shared/http/version";
import type { TieDealInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation, type DealAnswer } from "./sponsor-mutation";

/** Ties a deal recorded against its sponsor to its episode; its items take their dates from then on. */
export const useTieDeal = (channelId: string, dealId: string) =>
  useSponsorMutation(channelId, (input: Versioned<TieDealInput>) => api<DealAnswer>(`${channelBase(channelId)}/deals/${dealId}/episode`, { method: "PUT", body: input }).then((r) => r.deal));
