import type { RunInput, RunView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useUpdateRun = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, ({ id, input, version }: { id: string; input: RunInput; version: number }) =>
    api<{ run: RunView }>(`${episodeBase(channelId, episodeId)}/bench-runs/${id}`, { method: "PUT", body: { ...input, version } }).then((r) => r.run),
  );
