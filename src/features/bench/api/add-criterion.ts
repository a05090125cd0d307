import type { CriterionInput, CriterionView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { episodeBase, useBenchMutation } from "./bench-mutation";

export const useAddCriterion = (channelId: string, episodeId: string) =>
  useBenchMutation(channelId, (input: CriterionInput) =>
    api<{ criterion: CriterionView }>(`${episodeBase(channelId, episodeId)}/test-plan/criteria`, { method: "POST", body: input }).then((r) => r.criterion),
  );
