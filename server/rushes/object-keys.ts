import { randomUUID } from "node:crypto";

/**
 * Object keys are Kerf's, never the file's: channel/episode/uuid. A file name can carry slashes,
 * "..", control characters or another person's name; none of it reaches the store's key space.
 * The file name travels only as the download's Content-Disposition.
 */
export function footageKey(channelId: string, episodeId: string): string {
  return `${channelId}/${episodeId}/${randomUUID()}`;
}

export function posterKey(channelId: string, episodeId: string): string {
  return `${channelId}/${episodeId}/${randomUUID()}`;
}

/** Photos not tied to an episode live under the channel's own "stills" prefix. */
export function stillKey(channelId: string, episodeId: string | null): string {
  return `${channelId}/${episodeId ?? "stills"}/${randomUUID()}`;
}

const keyPattern = /^[0-9a-f-]{36}\/([0-9a-f-]{36}|stills)\/[0-9a-f-]{36}$/;

/** A key Kerf could have made: the check a job or a test runs before it touches an object. */
export function isKerfKey(key: string): boolean {
  return keyPattern.test(key);
}

/** The server's small playable copy of a clip, beside its footage. */
export function proxyKey(channelId: string, episodeId: string): string {
  return `${channelId}/${episodeId}/${randomUUID()}`;
}
