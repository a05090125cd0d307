export const channelKeys = {
  all: ["channels"] as const,
  members: (channelId: string) => [...channelKeys.all, channelId, "members"] as const,
  invitation: (token: string) => [...channelKeys.all, "invitation", token] as const,
};
