import { queryOptions, useQuery } from "@tanstack/react-query";
import type { InvitationPreview } from "@shared/channels/schemas";
import { api } from "../../../lib/api-client";
import { channelKeys } from "./keys";

export const invitationPath = (token: string) => `/api/invitations/${encodeURIComponent(token)}`;

export const invitationQueryOptions = (token: string) =>
  queryOptions({ queryKey: channelKeys.invitation(token), queryFn: () => api<InvitationPreview>(invitationPath(token)) });

export const useInvitation = (token: string) => useQuery(invitationQueryOptions(token));
