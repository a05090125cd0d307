import { episodeBase } from "./bench-mutation";

/** The runs as CSV (RFC 4180): a plain link, so the browser downloads it with the session cookie. */
export const runsCsvUrl = (channelId: string, episodeId: string) => `${episodeBase(channelId, episodeId)}/bench-runs.csv`;
