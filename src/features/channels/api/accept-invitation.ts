import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Me } from "@shared/auth/schemas";
import type { AcceptInvitationInput } from "@shared/channels/schemas";
import { api } from "../../../lib/api-client";
import { adoptSession } from "../../../lib/session";
import { invitationPath } from "./get-invitation";

export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: AcceptInvitationInput) => api<{ channelId: string; me: Me }>(`${invitationPath(token)}/accept`, { method: "POST", body: input }),
    onSuccess: ({ me }) => adoptSession(queryClient, me),
  });
}
