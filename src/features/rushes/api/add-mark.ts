import type { MarkInput, MarkView } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { useClipMutation } from "./clip-mutation";
import { clipPath } from "./get-clip";

export const useAddMark = (channelId: string, clipId: string) =>
  useClipMutation(channelId, (input: MarkInput) => api<{ mark: MarkView }>(`${clipPath(channelId, clipId)}/marks`, { method: "POST", body: input }));
