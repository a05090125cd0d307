import type { InviteInput } from "@shared/channels/schemas";
import { api } from "../../../lib/api-client";
import { base, useMembersMutation } from "./members-mutation";

export const useInvite = (channelId: string) =>
  useMembersMutation(channelId, (input: InviteInput) => api(`${base(channelId)}/invitations`, { method: "POST", body: input }));
