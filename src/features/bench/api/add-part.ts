import type { PartInput, PartView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { partsBase, useBenchMutation } from "./bench-mutation";

export const useAddPart = (channelId: string) =>
  useBenchMutation(channelId, (input: PartInput) => api<{ part: PartView }>(partsBase(channelId), { method: "POST", body: input }).then((r) => r.part));
