/** Query keys of the home, general to specific. */
export const homeKeys = {
  all: ["home"] as const,
  channel: (channelId: string) => [...homeKeys.all, channelId] as const,
};
