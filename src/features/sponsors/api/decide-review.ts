import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ReviewDecisionInput, ReviewPage } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { reviewPath } from "./get-review";
import { sponsorKeys } from "./keys";

/** The sponsor's decision; the answer is the page's next state, put straight into the cache. */
export function useDecide(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ReviewDecisionInput) => api<ReviewPage>(`${reviewPath(token)}/decision`, { method: "POST", body: input }),
    onSuccess: (page) => queryClient.setQueryData(sponsorKeys.review(token), page),
    onError: () => queryClient.invalidateQueries({ queryKey: sponsorKeys.review(token) }),
  });
}
