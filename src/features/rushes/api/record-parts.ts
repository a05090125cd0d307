import type { RecordPartsInput, UploadPart } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { uploadsBase } from "./start-upload";

/**
 * Tells Kerf some parts reached storage (each one's ETag and size), so a reload can resume from there.
 * `leaving`: sent as the page closes, so the request outlives it.
 */
export const recordParts = (channelId: string, uploadId: string, parts: UploadPart[], leaving = false) =>
  api<{ parts: UploadPart[] }>(`${uploadsBase(channelId)}/${uploadId}/parts`, { method: "POST", body: { parts } satisfies RecordPartsInput, keepalive: leaving });
