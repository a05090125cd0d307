import type { RunInput, RunView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useAddRun = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, (input: RunInput) =>
    api<{ run: RunView }>(`${episodeBase(channelId, episodeId)}/bench-runs`, { method: "POST", body: input }).then((r) => r.run),
  );
