import { queryOptions, useQuery } from "@tanstack/react-query";
import type { PartRunView, PartView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { partsBase } from "./bench-mutation";
import { benchKeys } from "./keys";

export const partQueryOptions = (channelId: string, partId: string) =>
  queryOptions({
    queryKey: benchKeys.part(channelId, partId),
    queryFn: () => api<{ part: PartView; runs: PartRunView[] }>(`${partsBase(channelId)}/${partId}`),
  });

export const usePart = (channelId: string, partId: string) => useQuery(partQueryOptions(channelId, partId));
