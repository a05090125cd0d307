import { queryOptions, useQuery } from "@tanstack/react-query";
import type { DealTemplate } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { channelBase, sponsorKeys } from "./keys";

export const templatesQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: sponsorKeys.templates(channelId),
    queryFn: () => api<{ templates: DealTemplate[] }>(`${channelBase(channelId)}/deal-templates`).then((r) => r.templates),
  });

export const useTemplates = (channelId: string) => useQuery(templatesQueryOptions(channelId));
