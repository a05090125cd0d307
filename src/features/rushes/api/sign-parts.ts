import { api } from "../../../lib/api-client";
import { uploadsBase } from "./start-upload";

/** Presigned URLs for the given parts, each good for one PUT straight to storage. */
export const signParts = (channelId: string, uploadId: string, partNumbers: number[]) =>
  api<{ urls: { partNumber: number; url: string }[] }>(`${uploadsBase(channelId)}/${uploadId}/part-urls`, { method: "POST", body: { partNumbers } }).then((r) => r.urls);
