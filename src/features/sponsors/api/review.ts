import { queryOptions, useMutation, useQuery, useQueryClient } from "@tanstack/react-query";
import type { ReviewDecisionInput, ReviewPage } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { sponsorKeys } from "./keys";

const path = (token: string) => `/api/review/${encodeURIComponent(token)}`;

export const reviewQueryOptions = (token: string) => queryOptions({ queryKey: sponsorKeys.review(token), queryFn: () => api<ReviewPage>(path(token)), staleTime: 0 });

export const useReview = (token: string) => useQuery(reviewQueryOptions(token));

/** The sponsor's decision; the answer is the page's next state, put straight into the cache. */
export function useDecide(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ReviewDecisionInput) => api<ReviewPage>(`${path(token)}/decision`, { method: "POST", body: input }),
    onSuccess: (page) => queryClient.setQueryData(sponsorKeys.review(token), page),
    onError: () => queryClient.invalidateQueries({ queryKey: sponsorKeys.review(token) }),
  });
}
