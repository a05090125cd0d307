import type { HandSuggestion, IdeaView, Judgement } from "@shared/intake/schemas";
import { api } from "../../../lib/api-client";
import { useIntakeMutation } from "./intake-mutation";
import { intakeBase } from "./keys";

/** The writes on ideas, each one endpoint: all refresh the channel's intake (useIntakeMutation). */
type IdeaAnswer = { idea: IdeaView };
const ideaPath = (channelId: string, ideaId: string) => `${intakeBase(channelId)}/ideas/${ideaId}`;

export const useAddByHand = (channelId: string) =>
  useIntakeMutation(channelId, (body: HandSuggestion) => api<{ ideaId: string; joined: boolean }>(`${intakeBase(channelId)}/suggestions`, { method: "POST", body }));

export const useMergeIdeas = (channelId: string) =>
  useIntakeMutation(channelId, ({ ideaId, otherIdeaId }: { ideaId: string; otherIdeaId: string }) => api<IdeaAnswer>(`${ideaPath(channelId, ideaId)}/merge`, { method: "POST", body: { otherIdeaId } }));

export const useSplitSuggestion = (channelId: string) =>
  useIntakeMutation(channelId, (suggestionId: string) => api<IdeaAnswer>(`${intakeBase(channelId)}/suggestions/${suggestionId}/split`, { method: "POST" }));

export const useJudgeIdea = (channelId: string) =>
  useIntakeMutation(channelId, ({ ideaId, judgement }: { ideaId: string; judgement: Judgement }) => api<IdeaAnswer>(`${ideaPath(channelId, ideaId)}/judgement`, { method: "PUT", body: judgement }));

export const useDeclineIdea = (channelId: string) =>
  useIntakeMutation(channelId, ({ ideaId, reason }: { ideaId: string; reason: string }) => api<IdeaAnswer>(`${ideaPath(channelId, ideaId)}/decline`, { method: "POST", body: { reason } }));

export const useSetIdeaAside = (channelId: string) =>
  useIntakeMutation(channelId, ({ ideaId, aside }: { ideaId: string; aside: boolean }) => api<IdeaAnswer>(`${ideaPath(channelId, ideaId)}/${aside ? "park" : "reopen"}`, { method: "POST" }));

export const usePromoteIdea = (channelId: string) =>
  useIntakeMutation(channelId, (ideaId: string) => api<IdeaAnswer & { episodeId: string }>(`${ideaPath(channelId, ideaId)}/promote`, { method: "POST" }), true);
