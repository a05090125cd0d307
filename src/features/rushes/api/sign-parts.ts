import type { PartUrlsAnswer, PartUrlsInput } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { uploadsBase } from "./start-upload";

/** Presigned URLs for the given parts, each good for one PUT of exactly its size straight to storage. */
export const signParts = (channelId: string, uploadId: string, parts: PartUrlsInput["parts"]) =>
  api<PartUrlsAnswer>(`${uploadsBase(channelId)}/${uploadId}/part-urls`, { method: "POST", body: { parts } satisfies PartUrlsInput }).then((r) => r.urls);
