/** Query keys of the calendar, general to specific. */
export const calendarKeys = {
  all: ["calendar"] as const,
  channel: (channelId: string) => [...calendarKeys.all, channelId] as const,
  range: (channelId: string, from: string, to: string) => [...calendarKeys.channel(channelId), "range", from, to] as const,
  feeds: () => [...calendarKeys.all, "feeds"] as const,
};
