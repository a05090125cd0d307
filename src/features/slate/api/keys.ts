import type { BoardFilters } from "@shared/slate/schemas";

/** Every slate query key, general to specific, so a mutation can invalidate at any level. */
export const slateKeys = {
  all: ["slate"] as const,
  channel: (channelId: string) => [...slateKeys.all, channelId] as const,
  boards: (channelId: string) => [...slateKeys.channel(channelId), "board"] as const,
  board: (channelId: string, filters: BoardFilters) => [...slateKeys.boards(channelId), filters] as const,
  details: (channelId: string) => [...slateKeys.channel(channelId), "detail"] as const,
  detail: (channelId: string, episodeId: string) => [...slateKeys.details(channelId), episodeId] as const,
  history: (channelId: string, episodeId: string) => [...slateKeys.detail(channelId, episodeId), "history"] as const,
  comments: (channelId: string, episodeId: string) => [...slateKeys.detail(channelId, episodeId), "comments"] as const,
  people: (channelId: string) => [...slateKeys.channel(channelId), "people"] as const,
  settings: (channelId: string) => [...slateKeys.channel(channelId), "settings"] as const,
};
