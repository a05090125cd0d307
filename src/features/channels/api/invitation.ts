import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { Me } from "@shared/auth/schemas";
import type { AcceptInvitationInput, InvitationPreview } from "@shared/channels/schemas";
import { api } from "../../../lib/api-client";
import { adoptSession } from "../../../lib/session";
import { channelKeys } from "./keys";

const path = (token: string) => `/api/invitations/${encodeURIComponent(token)}`;

export const invitationQueryOptions = (token: string) =>
  queryOptions({ queryKey: channelKeys.invitation(token), queryFn: () => api<InvitationPreview>(path(token)) });

export const useInvitation = (token: string) => useQuery(invitationQueryOptions(token));

export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AcceptInvitationInput) => api<{ channelId: string; me: Me }>(`${path(token)}/accept`, { method: "POST", body: input }),
    onSuccess: ({ me }) => adoptSession(queryClient, me),
  });
}
