import { api } from "../../../lib/api-client";
import { uploadsBase } from "./start-upload";

/** Aborts the upload in storage and forgets its parts. */
export const cancelUpload = (channelId: string, uploadId: string) => api<void>(`${uploadsBase(channelId)}/${uploadId}`, { method: "DELETE" });
