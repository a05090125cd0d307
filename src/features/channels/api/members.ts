import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { Role } from "@shared/access/roles";
import type { InviteInput, MembersPage } from "@shared/channels/schemas";
import { api } from "../../../lib/api-client";
import { channelKeys } from "./keys";

const base = (channelId: string) => `/api/channels/${channelId}`;

export const membersQueryOptions = (channelId: string) =>
  queryOptions({ queryKey: channelKeys.members(channelId), queryFn: () => api<MembersPage>(`${base(channelId)}/members`) });

export const useMembers = (channelId: string) => useQuery(membersQueryOptions(channelId));

function useMembersMutation<V>(channelId: string, send: (variables: V) => Promise<unknown>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSettled: () => queryClient.invalidateQueries({ queryKey: channelKeys.members(channelId) }),
  });
}

export const useInvite = (channelId: string) =>
  useMembersMutation(channelId, (input: InviteInput) => api(`${base(channelId)}/invitations`, { method: "POST", body: input }));

export const useRevokeInvitation = (channelId: string) =>
  useMembersMutation(channelId, (invitationId: string) => api(`${base(channelId)}/invitations/${invitationId}`, { method: "DELETE" }));

export const useChangeRole = (channelId: string) =>
  useMembersMutation(channelId, ({ userId, role }: { userId: string; role: Role }) =>
    api(`${base(channelId)}/members/${userId}`, { method: "PATCH", body: { role } }),
  );

export const useRemoveMember = (channelId: string) =>
  useMembersMutation(channelId, (userId: string) => api(`${base(channelId)}/members/${userId}`, { method: "DELETE" }));
