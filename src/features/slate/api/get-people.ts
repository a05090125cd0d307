import { queryOptions, useQuery } from "@tanstack/react-query";
import type { SlatePerson } from "@shared/slate/schemas";
import { api } from "../../../lib/api-client";
import { slateKeys } from "./keys";

export const peopleQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: slateKeys.people(channelId),
    queryFn: ({ signal }) => api<{ people: SlatePerson[] }>(`/api/channels/${channelId}/slate/people`, { signal }).then((r) => r.people),
    staleTime: 60_000,
  });

export const usePeople = (channelId: string) => useQuery(peopleQueryOptions(channelId));
