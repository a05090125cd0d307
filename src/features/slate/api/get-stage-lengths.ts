import { queryOptions, useQuery } from "@tanstack/react-query";
import type { StageLengths } from "@shared/slate/schedule";
import { api } from "../../../lib/api-client";
import { slateKeys } from "./keys";

export interface StageLengthSettings {
  stageLengths: StageLengths;
  custom: boolean;
}

export const stageLengthsPath = (channelId: string) => `/api/channels/${channelId}/slate/settings`;

export const stageLengthsQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: slateKeys.settings(channelId),
    queryFn: ({ signal }) => api<StageLengthSettings>(stageLengthsPath(channelId), { signal }),
  });

export const useStageLengths = (channelId: string) => useQuery(stageLengthsQueryOptions(channelId));
