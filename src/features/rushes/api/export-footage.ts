/** The footage as CSV, EDL or OpenTimelineIO for the list's filters, and chosen clips as a zip: plain links, downloaded with the session cookie. */
export const exportUrl = (channelId: string, kind: "csv" | "edl" | "otio", query: string) => `/api/channels/${channelId}/exports/footage.${kind}?${query}`;
export const zipUrl = (channelId: string, ids: string[]) => `/api/channels/${channelId}/exports/footage.zip?ids=${ids.join(",")}`;
