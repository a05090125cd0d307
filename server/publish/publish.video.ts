import { dateInZone, shiftDate } from "../../shared/sponsors/dates";
import type { PublishedVideoReader } from "../seams/published-video";
import { listFigures } from "./figures.repository";
import { findPackage } from "./package.repository";

/** The video as published, for other features (the sponsor's report): its time, link, description and figures. */
export const publishedVideo: PublishedVideoReader = {
  async read(db, { channelId, episodeId }) {
    const [pkg, rows] = await Promise.all([findPackage(db, channelId, episodeId), listFigures(db, channelId, episodeId)]);
    const liveOn = pkg?.publishedAt ? dateInZone(pkg.publishedAt, pkg.timeZone) : null;
    return {
      publishedAt: pkg?.publishedAt?.toISOString() ?? null,
      liveOn,
      videoUrl: pkg?.videoUrl ?? null,
      description: pkg?.description ?? "",
      figures: rows.map(({ figures: f }) => ({ day: f.day, dueOn: liveOn ? shiftDate(liveOn, f.day) : null, values: { views: f.views, watchHours: f.watchHours, linkClicks: f.linkClicks, codeUses: f.codeUses } })),
    };
  },
};
