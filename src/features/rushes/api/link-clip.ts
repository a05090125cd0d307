import type { ClipDetail } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { useClipMutation } from "./clip-mutation";
import { clipPath } from "./get-clip";

export interface ClipLinks {
  benchRunId?: string | null;
  buildIterationId?: string | null;
}

/** Links any clip of the episode to a run or an iteration (or clears it), from the run's or iteration's side. */
export const useLinkClip = (channelId: string) =>
  useClipMutation(channelId, ({ clipId, links }: { clipId: string; links: ClipLinks }) =>
    api<{ clip: ClipDetail }>(clipPath(channelId, clipId), { method: "PATCH", body: links }).then((r) => r.clip),
  );
