import type { DealTemplate, TemplateInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const useSaveTemplate = (channelId: string) =>
  useSponsorMutation(channelId, ({ id, input }: { id: string | null; input: TemplateInput }) =>
    api<{ template: DealTemplate }>(id ? `${channelBase(channelId)}/deal-templates/${id}` : `${channelBase(channelId)}/deal-templates`, {
      method: id ? "PUT" : "POST",
      body: input,
    }).then((r) => r.template),
  );
