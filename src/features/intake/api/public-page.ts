import { queryOptions, useMutation, useQuery } from "@tanstack/react-query";
import type { PublicSuggestion } from "@shared/intake/schemas";
import { api } from "../../../lib/api-client";
import { intakeKeys } from "./keys";

/** The public page: no account; the CSRF token comes from /api/auth/me as on every page. */
export const publicPageQueryOptions = (channelId: string) =>
  queryOptions({
    queryKey: intakeKeys.publicPage(channelId),
    queryFn: () => api<{ page: { name: string; prompt: string } }>(`/api/suggestion-pages/${channelId}`).then((r) => r.page),
    retry: false,
  });

export const usePublicPage = (channelId: string) => useQuery(publicPageQueryOptions(channelId));

export const useSendSuggestion = (channelId: string) =>
  useMutation({ mutationFn: (body: PublicSuggestion) => api<{ received: true; message: string }>(`/api/suggestion-pages/${channelId}/suggestions`, { method: "POST", body }) });

/** Opening a mailed link: confirming the address, or stopping the channel's mail to it. */
export const useAddressLink = (action: "confirm" | "stop") =>
  useMutation({ mutationFn: (token: string) => api<{ channelName?: string }>(`/api/suggestion-addresses/${action}`, { method: "POST", body: { token } }) });
