import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { IdeaSort, IdeaStatus, IdeaView } from "@shared/intake/schemas";
import { api } from "../../../lib/api-client";
import { intakeBase, intakeKeys } from "./keys";

export const ideasQueryOptions = (channelId: string, status: IdeaStatus, sort: IdeaSort) =>
  queryOptions({
    queryKey: intakeKeys.ideas(channelId, status, sort),
    queryFn: () => api<{ ideas: IdeaView[]; total: number }>(`${intakeBase(channelId)}/ideas?${new URLSearchParams({ status, sort })}`),
    placeholderData: keepPreviousData,
  });

export const useIdeas = (channelId: string, status: IdeaStatus, sort: IdeaSort) => useQuery(ideasQueryOptions(channelId, status, sort));
