import type { IterationInput, IterationView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useAddIteration = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, (input: IterationInput) =>
    api<{ iteration: IterationView }>(`${episodeBase(channelId, episodeId)}/build-log`, { method: "POST", body: input }).then((r) => r.iteration),
  );
