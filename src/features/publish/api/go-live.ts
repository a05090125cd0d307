import type { GoLiveInput, PublishPackageView } from "@shared/publish/schemas";
import { api } from "../../../lib/api-client";
import { publishBase } from "./keys";
import { usePublishMutation } from "./publish-mutation";

export const useGoLive = (channelId: string, episodeId: string) =>
  usePublishMutation(channelId, episodeId, (input: GoLiveInput) =>
    api<{ package: PublishPackageView }>(`${publishBase(channelId, episodeId)}/go-live`, { method: "POST", body: input }).then((r) => r.package),
  );
