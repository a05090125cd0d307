import type { IdeaSort, IdeaStatus } from "@shared/intake/schemas";

/** Query keys of the intake, general to specific. */
export const intakeKeys = {
  all: ["intake"] as const,
  channel: (channelId: string) => [...intakeKeys.all, channelId] as const,
  page: (channelId: string) => [...intakeKeys.channel(channelId), "page"] as const,
  ideas: (channelId: string, status: IdeaStatus, sort: IdeaSort) => [...intakeKeys.channel(channelId), "ideas", status, sort] as const,
  idea: (channelId: string, ideaId: string) => [...intakeKeys.channel(channelId), "idea", ideaId] as const,
  publicPage: (channelId: string) => [...intakeKeys.all, "public", channelId] as const,
};

export const intakeBase = (channelId: string) => `/api/channels/${channelId}/intake`;
