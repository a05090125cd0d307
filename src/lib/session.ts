import { queryOptions, useQuery, type QueryClient } from "@tanstack/react-query";
import { useParams } from "react-router-dom";
import type { Me, Membership } from "@shared/auth/schemas";
import { api, rememberCsrfToken } from "./api-client";
import { browserTimeZone } from "./format";

/** Who is signed in and where they belong: read by every feature, so it lives below them all. */
export const sessionKeys = {
  all: ["session"] as const,
  me: () => [...sessionKeys.all, "me"] as const,
};

export async function fetchMe(): Promise<Me> {
  const me = await api<Me>("/api/auth/me");
  rememberCsrfToken(me.csrfToken);
  return me;
}

export const meQueryOptions = () => queryOptions({ queryKey: sessionKeys.me(), queryFn: fetchMe, staleTime: 60_000 });

export const useMe = () => useQuery(meQueryOptions());

/** A new session means new data everywhere: drop the old person's cache, keep the new `me`. */
export function adoptSession(queryClient: QueryClient, me: Me): void {
  rememberCsrfToken(me.csrfToken);
  queryClient.removeQueries({ predicate: (query) => query.queryKey[0] !== sessionKeys.all[0] });
  queryClient.setQueryData(sessionKeys.me(), me);
}

/** The channel named by the URL's :channelId, with the signed-in person's role in it. */
export function useCurrentChannel(): Membership | null {
  const { channelId } = useParams();
  const { data } = useMe();
  return data?.memberships.find((m) => m.channelId === channelId) ?? null;
}

/** The zone every time of day is shown in: the member's own, the browser's until they choose one. */
export function useTimeZone(): string {
  const { data } = useMe();
  return data?.user?.timeZone || browserTimeZone();
}

/** The channel of a page inside `/c/:channelId`, where the membership guard has already checked it. */
export function useChannel(): Membership {
  const channel = useCurrentChannel();
  if (!channel) throw new Error("This page belongs inside a channel the person is a member of.");
  return channel;
}
