import type { PackageInput, PublishPackageView } from "@shared/publish/schemas";
import { api } from "../../../lib/api-client";
import { publishBase } from "./keys";
import { usePublishMutation } from "./publish-mutation";

export const useSavePackage = (channelId: string, episodeId: string) =>
  usePublishMutation(channelId, episodeId, (input: PackageInput) =>
    api<{ package: PublishPackageView }>(publishBase(channelId, episodeId), { method: "PUT", body: input }).then((r) => r.package),
  );
