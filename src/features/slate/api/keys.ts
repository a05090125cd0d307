export const slateKeys = {
  all: ["slate"] as const,
  lists: (channelId: string) => [...slateKeys.all, channelId, "list"] as const,
  detail: (channelId: string, episodeId: string) => [...slateKeys.all, channelId, "detail", episodeId] as const,
};
