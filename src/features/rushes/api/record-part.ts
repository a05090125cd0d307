import { api } from "../../../lib/api-client";
import { uploadsBase } from "./start-upload";

/** Tells Kerf a part reached storage (its ETag and size), so a reload can resume from there. */
export const recordPart = (channelId: string, uploadId: string, partNumber: number, part: { etag: string; size: number }) =>
  api<void>(`${uploadsBase(channelId)}/${uploadId}/parts/${partNumber}`, { method: "PUT", body: part });
