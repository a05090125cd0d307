import { api } from "../../../lib/api-client";
import { base, useMembersMutation } from "./members-mutation";

export const useRevokeInvitation = (channelId: string) =>
  useMembersMutation(channelId, (invitationId: string) => api(`${base(channelId)}/invitations/${invitationId}`, { method: "DELETE" }));
