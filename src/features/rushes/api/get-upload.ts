import type { UploadView } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";
import { uploadsBase } from "./start-upload";

/** One upload as Kerf recorded it, with the parts storage holds: where a resumed upload carries on from. */
export const getUpload = (channelId: string, uploadId: string) => api<{ upload: UploadView }>(`${uploadsBase(channelId)}/${uploadId}`).then((r) => r.upload);
