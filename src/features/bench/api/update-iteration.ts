import type { IterationInput, IterationView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useUpdateIteration = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, ({ id, input, version }: { id: string; input: IterationInput; version: number }) =>
    api<{ iteration: IterationView }>(`${episodeBase(channelId, episodeId)}/build-log/${id}`, { method: "PUT", body: { ...input, version } }).then((r) => r.iteration),
  );
