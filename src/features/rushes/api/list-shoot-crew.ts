import { queryOptions, useQuery } from "@tanstack/react-query";
import { api } from "../../../lib/api-client";
import { rushesKeys } from "./keys";
import { shootBase } from "./shoot-mutation";

/** Who can be put on a shoot day: the channel's people by name. */
export const shootCrewQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: rushesKeys.shootCrew(channelId),
    queryFn: () => api<{ people: { userId: string; name: string; role: string }[] }>(`${shootBase(channelId)}/shoot-crew`).then((r) => r.people),
    staleTime: 60_000,
  });

export const useShootCrew = (channelId: string) => useQuery(shootCrewQueryOptions(channelId));
