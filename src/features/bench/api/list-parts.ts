import { queryOptions, useQuery } from "@tanstack/react-query";
import type { PartView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { partsBase } from "./bench-mutation";
import { benchKeys } from "./keys";

export const partsQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: benchKeys.parts(channelId),
    queryFn: () => api<{ parts: PartView[] }>(partsBase(channelId)).then((r) => r.parts),
  });

export const useParts = (channelId: string) => useQuery(partsQueryOptions(channelId));
