import { api } from "../../../lib/api-client";
import { base, useMembersMutation } from "./members-mutation";

export const useRemoveMember = (channelId: string) =>
  useMembersMutation(channelId, (userId: string) => api(`${base(channelId)}/members/${userId}`, { method: "DELETE" }));
