import { queryOptions, useQuery } from "@tanstack/react-query";
import type { PageSettings } from "@shared/intake/schemas";
import { api } from "../../../lib/api-client";
import { useIntakeMutation } from "./intake-mutation";
import { intakeBase, intakeKeys } from "./keys";

export const pageSettingsQueryOptions = (channelId: string) =>
  queryOptions({ queryKey: intakeKeys.page(channelId), queryFn: () => api<{ page: PageSettings }>(`${intakeBase(channelId)}/page`).then((r) => r.page) });

export const usePageSettings = (channelId: string) => useQuery(pageSettingsQueryOptions(channelId));

export const useSavePageSettings = (channelId: string) =>
  useIntakeMutation(channelId, (page: PageSettings) => api<{ page: PageSettings }>(`${intakeBase(channelId)}/page`, { method: "PUT", body: page }));
