/** Query keys of the money feature, general to specific, so a mutation can invalidate at any level. */
export const economicsKeys = {
  all: ["economics"] as const,
  channel: (channelId: string) => [...economicsKeys.all, channelId] as const,
  overview: (channelId: string) => [...economicsKeys.channel(channelId), "overview"] as const,
  episode: (channelId: string, episodeId: string) => [...economicsKeys.channel(channelId), "episode", episodeId] as const,
};

export const moneyBase = (channelId: string) => `/api/channels/${channelId}/money`;
export const episodeMoneyBase = (channelId: string, episodeId: string) => `/api/channels/${channelId}/episodes/${episodeId}/money`;
