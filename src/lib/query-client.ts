import { MutationCache, QueryCache, QueryClient } from "@tanstack/react-query";
import { ApiError } from "./api-client";
import { sessionKeys } from "./session";

export function makeQueryClient(): QueryClient {
  // A 401 anywhere means the session ended (expired, or signed out in another tab): asking for `me`
  // again lets the signed-in guard send the person to sign-in, and back here afterwards.
  const onError = (error: unknown, key?: readonly unknown[]) => {
    if (error instanceof ApiError && error.status === 401 && key?.[0] !== sessionKeys.all[0]) void queryClient.invalidateQueries({ queryKey: sessionKeys.me() });
  };
  const queryClient: QueryClient = new QueryClient({
    queryCache: new QueryCache({ onError: (error, query) => onError(error, query.queryKey) }),
    mutationCache: new MutationCache({ onError: (error) => onError(error) }),
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
