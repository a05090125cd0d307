import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { Me } from "@shared/auth/schemas";
import type { AcceptInvitationInput } from "@shared/channels/schemas";
import { api } from "../../../lib/api-client";
import { browserTimeZone } from "../../../lib/format";
import { adoptSession } from "../../../lib/session";
import { invitationPath } from "./get-invitation";

export function useAcceptInvitation(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    // A newcomer's account starts in this browser's zone; the account page changes it.
    mutationFn: (input: AcceptInvitationInput) =>
      api<{ channelId: string; me: Me }>(`${invitationPath(token)}/accept`, { method: "POST", body: "password" in input ? { ...input, timeZone: browserTimeZone() } : input }),
    onSuccess: ({ me }) => adoptSession(queryClient, me),
  });
}
