import type { ChecksumAnswer } from "@shared/rushes/schemas";
import { api } from "../../../lib/api-client";

/** The channel's clip with this SHA-256, if it has one: asked before a file is sent. */
export const findByChecksum = (channelId: string, sha256: string) =>
  api<ChecksumAnswer>(`/api/channels/${channelId}/footage-checksums/${sha256}`).then((r) => r.clip);
