/** Query keys of the bench feature, general to specific, so a mutation can invalidate at any level. */
export const benchKeys = {
  all: ["bench"] as const,
  channel: (channelId: string) => [...benchKeys.all, channelId] as const,
  parts: (channelId: string) => [...benchKeys.channel(channelId), "parts"] as const,
  part: (channelId: string, partId: string) => [...benchKeys.parts(channelId), partId] as const,
  cardColours: (channelId: string) => [...benchKeys.channel(channelId), "card-colours"] as const,
  episode: (channelId: string, episodeId: string) => [...benchKeys.channel(channelId), "episode", episodeId] as const,
  testPlan: (channelId: string, episodeId: string) => [...benchKeys.episode(channelId, episodeId), "test-plan"] as const,
  runs: (channelId: string, episodeId: string) => [...benchKeys.episode(channelId, episodeId), "runs"] as const,
  buildLog: (channelId: string, episodeId: string) => [...benchKeys.episode(channelId, episodeId), "build-log"] as const,
  resultsCard: (channelId: string, episodeId: string) => [...benchKeys.episode(channelId, episodeId), "results-card"] as const,
  buildPhotos: (channelId: string, episodeId: string) => [...benchKeys.episode(channelId, episodeId), "build-photos"] as const,
};
