import type { PartInput, PartView } from "@shared/bench/schemas";
import { api } from "../../../lib/api-client";
import { partsBase, useBenchMutation } from "./bench-mutation";

export const useUpdatePart = (channelId: string) =>
  useBenchMutation(channelId, ({ id, input, version }: { id: string; input: PartInput; version: number }) =>
    api<{ part: PartView }>(`${partsBase(channelId)}/${id}`, { method: "PUT", body: { ...input, version } }).then((r) => r.part),
  );
