/** Query keys of the publish feature, general to specific. */
export const publishKeys = {
  all: ["publish"] as const,
  channel: (channelId: string) => [...publishKeys.all, channelId] as const,
  package: (channelId: string, episodeId: string) => [...publishKeys.channel(channelId), "package", episodeId] as const,
  figures: (channelId: string, episodeId: string) => [...publishKeys.channel(channelId), "figures", episodeId] as const,
};

export const publishBase = (channelId: string, episodeId: string) => `/api/channels/${channelId}/episodes/${episodeId}/publish`;
