import { queryOptions, useQuery } from "@tanstack/react-query";
import type { MembersPage } from "@shared/channels/schemas";
import { api } from "../../../lib/api-client";
import { channelKeys } from "./keys";
import { base } from "./members-mutation";

export const membersQueryOptions = (channelId: string) =>
  queryOptions({ queryKey: channelKeys.members(channelId), queryFn: () => api<MembersPage>(`${base(channelId)}/members`) });

export const useMembers = (channelId: string) => useQuery(membersQueryOptions(channelId));
