import { queryOptions, useQuery } from "@tanstack/react-query";
import type { ReviewPage } from "@shared/sponsors/schemas";
import { api } from "../../../lib/api-client";
import { sponsorKeys } from "./keys";

export const reviewPath = (token: string) => `/api/review/${encodeURIComponent(token)}`;

export const reviewQueryOptions = (token: string) => queryOptions({ queryKey: sponsorKeys.review(token), queryFn: () => api<ReviewPage>(reviewPath(token)), staleTime: 0 });

export const useReview = (token: string) => useQuery(reviewQueryOptions(token));
