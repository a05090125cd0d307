import type { CriterionInput, CriterionView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useUpdateCriterion = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, ({ id, input, version }: { id: string; input: CriterionInput; version: number }) =>
    api<{ criterion: CriterionView }>(`${episodeBase(channelId, episodeId)}/test-plan/criteria/${id}`, { method: "PUT", body: { ...input, version } }).then((r) => r.criterion),
  );
