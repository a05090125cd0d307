import { queryOptions, useQuery } from "@tanstack/react-query";
import type { FeedSummary } from "@shared/calendar/feeds";
import { api } from "../../../lib/api-client";
import { calendarKeys } from "./keys";

export const feedsQueryOptions = () =>
  queryOptions({
    queryKey: calendarKeys.feeds(),
    queryFn: () => api<{ feeds: FeedSummary[] }>("/api/account/calendar-feeds").then((r) => r.feeds),
  });

export const useFeeds = () => useQuery(feedsQueryOptions());
