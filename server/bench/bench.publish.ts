import type { PublishSource } from "../seams/publish-sources";
import { partsUsedInEpisode } from "./shelf.repository";

/** What the publish package takes from the bench: the parts the episode's runs used, with where they were bought. */
export const benchPublishSource: PublishSource = {
  name: "bench.parts",
  async read(db, { channelId, episodeId }) {
    const rows = await partsUsedInEpisode(db, channelId, episodeId);
    return { parts: rows.map((row) => ({ name: row.name, boughtFrom: row.supplier.trim() || null })) };
  },
};
