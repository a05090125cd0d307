import { queryOptions, useQuery } from "@tanstack/react-query";
import type { PublishPackageView } from "@shared/publish/schemas";
import { api } from "../../../lib/api-client";
import { publishBase, publishKeys } from "./keys";

export const packageQueryOptions = (channelId: string, episodeId: string) =>
  queryOptions({
    queryKey: publishKeys.package(channelId, episodeId),
    queryFn: () => api<{ package: PublishPackageView }>(publishBase(channelId, episodeId)).then((r) => r.package),
    // The description is drafted from the bench's parts and the episode's words.
    meta: { follows: ["bench", "episode"] },
  });

export const usePackage = (channelId: string, episodeId: string) => useQuery(packageQueryOptions(channelId, episodeId));
