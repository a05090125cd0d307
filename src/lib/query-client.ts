import { MutationCache, QueryCache, QueryClient, type Mutation } from "@tanstack/react-query";
import { ApiError } from "./api-client";
import { sessionKeys } from "./session";

/**
 * What a write changes and what a read follows, named in the product's words, so one feature's write
 * refreshes another feature's data without either importing the other: a mutation says
 * `meta: { changes: ["episode"] }`, a query `meta: { follows: ["episode"] }`.
 */
export type DataTopic = "episode" | "footage" | "bench" | "publish";

declare module "@tanstack/react-query" {
  interface Register {
    queryMeta: { follows?: readonly DataTopic[] };
    mutationMeta: { changes?: readonly DataTopic[] };
  }
}

/** Reads again every query that follows one of these topics. */
export function refreshFollowers(queryClient: QueryClient, changed: readonly DataTopic[]): void {
  if (changed.length > 0) void queryClient.invalidateQueries({ predicate: (query) => (query.meta?.follows ?? []).some((topic) => changed.includes(topic)) });
}

export function makeQueryClient(): QueryClient {
  // A 401 anywhere means the session ended (expired, or signed out in another tab): asking for `me`
  // again lets the signed-in guard send the person to sign-in, and back here afterwards.
  const onError = (error: unknown, key?: readonly unknown[]) => {
    if (error instanceof ApiError && error.status === 401 && key?.[0] !== sessionKeys.all[0]) void queryClient.invalidateQueries({ queryKey: sessionKeys.me() });
  };
  const queryClient: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError: (error, query) => onError(error, query.queryKey) }),
    mutationCache: new MutationCache({
      onError: (error) => onError(error),
      onSuccess: (_data, _variables, _context, mutation: Mutation<unknown, unknown, unknown, unknown>) => refreshFollowers(queryClient, mutation.meta?.changes ?? []),
    }),
    defaultOptions: {
      queries: {
        staleTime: 15_000,
        // A 4xx will not change on retry; a dropped connection or a 5xx might.
        retry: (count, error) => count < 2 && !(error instanceof ApiError && error.status >= 400 && error.status < 500),
      },
    },
  });
  return queryClient;
}
