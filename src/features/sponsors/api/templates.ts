import { queryOptions, useQuery } from "@tanstack/react-query";
import type { DealTemplate, TemplateInput } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase, sponsorKeys } from "./keys";
import { useSponsorMutation } from "./sponsor-mutation";

export const templatesQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: sponsorKeys.templates(channelId),
    queryFn: () => api<{ templates: DealTemplate[] }>(`${channelBase(channelId)}/deal-templates`).then((r) => r.templates),
  });

export const useTemplates = (channelId: string) => useQuery(templatesQueryOptions(channelId));

/** A new template (no id), or a change of one against the version its form opened with. */
export const useSaveTemplate = (channelId: string) =>
  useSponsorMutation(channelId, ({ id, input, version }: { id: string | null; input: TemplateInput; version: number }) =>
    api<{ template: DealTemplate }>(id ? `${channelBase(channelId)}/deal-templates/${id}` : `${channelBase(channelId)}/deal-templates`, {
      method: id ? "PUT" : "POST",
      body: id ? { ...input, version } : input,
    }).then((r) => r.template),
  );

export const useDeleteTemplate = (channelId: string) =>
  useSponsorMutation(channelId, (templateId: string) => api(`${channelBase(channelId)}/deal-templates/${templateId}`, { method: "DELETE" }));
