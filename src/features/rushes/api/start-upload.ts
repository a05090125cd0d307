import type { ClipMetadata, UploadView } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";

export const uploadsBase = (channelId: string) => `/api/channels/${channelId}/uploads`;

export interface StartUpload {
  episodeId: string;
  fileName: string;
  size: number;
  fingerprint: string;
  metadata?: ClipMetadata;
}

/** Opens a multipart upload in storage; the answer says how the file is cut into parts. */
export const startUpload = (channelId: string, body: StartUpload) => api<{ upload: UploadView }>(uploadsBase(channelId), { method: "POST", body }).then((r) => r.upload);
