import { queryOptions, useQuery } from "@tanstack/react-query";
import type { IdeaView, SuggestionView } from "@shared/intake/schemas";
import { api } from "../../../lib/api-client";
import { intakeBase, intakeKeys } from "./keys";

export const ideaQueryOptions = (channelId: string, ideaId: string) =>
  queryOptions({
    queryKey: intakeKeys.idea(channelId, ideaId),
    queryFn: () => api<{ idea: IdeaView; suggestions: SuggestionView[] }>(`${intakeBase(channelId)}/ideas/${ideaId}`),
  });

export const useIdea = (channelId: string, ideaId: string, enabled = true) => useQuery({ ...ideaQueryOptions(channelId, ideaId), enabled });
