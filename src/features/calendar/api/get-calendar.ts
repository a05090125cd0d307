import { keepPreviousData, queryOptions, useQuery } from "@tanstack/react-query";
import type { CalendarView } from "@shared/calendar/entries";
import { api } from "../../../lib/api-client";
import { calendarKeys } from "./keys";

export const calendarQueryOptions = (channelId: string, from: string, to: string) =>
  queryOptions({
    queryKey: calendarKeys.range(channelId, from, to),
    queryFn: ({ signal }) => api<{ calendar: CalendarView }>(`/api/channels/${channelId}/calendar?${new URLSearchParams({ from, to })}`, { signal }).then((r) => r.calendar),
    // Every feature's dates land here: any change to an episode or its package reads the days again.
    meta: { follows: ["episode", "publish", "footage"] },
  });

/** The days asked for; while the next month loads, the last one stays on screen. */
export const useCalendar = (channelId: string, from: string, to: string) => useQuery({ ...calendarQueryOptions(channelId, from, to), placeholderData: keepPreviousData });
