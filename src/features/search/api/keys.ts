/** Query keys of search, general to specific. */
export const searchKeys = {
  all: ["search"] as const,
  channel: (channelId: string) => [...searchKeys.all, channelId] as const,
  results: (channelId: string, query: string) => [...searchKeys.channel(channelId), query] as const,
};
