import type { IterationInput, IterationView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useUpdateIteration = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, ({ id, input }: { id: string; input: IterationInput }) =>
    api<{ iteration: IterationView }>(`${episodeBase(channelId, episodeId)}/build-log/${id}`, { method: "PUT", body: input }).then((r) => r.iteration),
  );
