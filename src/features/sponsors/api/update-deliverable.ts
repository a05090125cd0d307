import type { Versioned } from "@shared/http/version";
import type { UpdateDeliverableInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation, type DealAnswer } from "./sponsor-mutation";

export const useUpdateDeliverable = (channelId: string) =>
  useSponsorMutation(channelId, ({ id, input }: { id: string; input: Versioned<UpdateDeliverableInput> }) =>
    api<DealAnswer>(`${channelBase(channelId)}/deliverables/${id}`, { method: "PATCH", body: input }),
  );
