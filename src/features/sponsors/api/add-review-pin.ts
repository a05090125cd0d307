import { useMutation, useQueryClient } from "@tanstack/react-query";
import type { ReviewPage, ReviewPinInput, ReviewPinView } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { reviewPath } from "./get-review";
import { sponsorKeys } from "./keys";

/** The sponsor pins a comment to a moment of the segment; it joins the page's list in the segment's order. */
export function useAddReviewPin(token: string) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (input: ReviewPinInput) => api<{ pin: ReviewPinView }>(`${reviewPath(token)}/pins`, { method: "POST", body: input }).then((r) => r.pin),
    onSuccess: (pin) =>
      queryClient.setQueryData<ReviewPage>(sponsorKeys.review(token), (page) =>
        page && page.state === "open" ? { ...page, pins: [...page.pins, pin].sort((a, b) => a.atSeconds - b.atSeconds) } : page,
      ),
    // A closed link (410) shows the page as it is now.
    onError: () => queryClient.invalidateQueries({ queryKey: sponsorKeys.review(token) }),
  });
}
