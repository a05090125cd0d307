import type { DealTemplate, TemplateInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

/** A new template (no id), or a change of one against the version its form opened with. */
export const useSaveTemplate = (channelId: string) =>
  useSponsorMutation(channelId, ({ id, input, version }: { id: string | null; input: TemplateInput; version: number }) =>
    api<{ template: DealTemplate }>(id ? `${channelBase(channelId)}/deal-templates/${id}` : `${channelBase(channelId)}/deal-templates`, {
      method: id ? "PUT" : "POST",
      body: id ? { ...input, version } : input,
    }).then((r) => r.template),
  );
