/** One key factory for the rushes feature: general to specific, so invalidation can aim at any level. */
export const rushesKeys = {
  all: ["rushes"] as const,
  channel: (channelId: string) => [...rushesKeys.all, channelId] as const,
  footage: (channelId: string) => [...rushesKeys.channel(channelId), "footage"] as const,
  footageList: (channelId: string, query: string) => [...rushesKeys.footage(channelId), "list", query] as const,
  edlRates: (channelId: string, query: string) => [...rushesKeys.footage(channelId), "edl-rates", query] as const,
  clip: (channelId: string, clipId: string) => [...rushesKeys.footage(channelId), "clip", clipId] as const,
  /** The link to the original, or to the proxy the server made on its n-th attempt (a new attempt, a new proxy). */
  preview: (channelId: string, clipId: string, proxyOfAttempt: number | null = null) =>
    [...rushesKeys.footage(channelId), "preview", clipId, proxyOfAttempt === null ? "original" : `proxy-${proxyOfAttempt}`] as const,
  footageLinks: (channelId: string, episodeId: string) => [...rushesKeys.footage(channelId), "links", episodeId] as const,
  shoot: (channelId: string, episodeId: string) => [...rushesKeys.channel(channelId), "shoot", episodeId] as const,
  shootDays: (channelId: string, episodeId: string) => [...rushesKeys.shoot(channelId, episodeId), "days"] as const,
  shots: (channelId: string, episodeId: string) => [...rushesKeys.shoot(channelId, episodeId), "shots"] as const,
  shootDayPages: (channelId: string) => [...rushesKeys.channel(channelId), "shoot-day"] as const,
  shootDay: (channelId: string, shootDayId: string) => [...rushesKeys.shootDayPages(channelId), shootDayId] as const,
  shootCrew: (channelId: string) => [...rushesKeys.channel(channelId), "shoot-crew"] as const,
  episodeTitles: (channelId: string) => [...rushesKeys.channel(channelId), "episode-titles"] as const,
  openUploads: (channelId: string, episodeId: string) => [...rushesKeys.channel(channelId), "uploads", episodeId] as const,
};
