import type { PartInput, PartView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { partsBase, useBenchMutation } from "./bench-mutation";

export const useUpdatePart = (channelId: string) =>
  useBenchMutation(channelId, ({ id, input }: { id: string; input: PartInput }) =>
    api<{ part: PartView }>(`${partsBase(channelId)}/${id}`, { method: "PUT", body: input }).then((r) => r.part),
  );
