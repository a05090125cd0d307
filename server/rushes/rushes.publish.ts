import type { MarkSpan } from "../../shared/publish/markers";
import { MAX_EDL_EVENTS } from "../../shared/rushes/exports/edl";
import type { PublishSource } from "../seams/publish-sources";
import { episodeMarks } from "./exports.repository";

/** What the publish package takes from the footage: its marks, to lay out as chapters (clips without a known rate can't be timed). */
export const rushesPublishSource: PublishSource = {
  name: "rushes.marks",
  async read(db, { channelId, episodeId }) {
    const rows = await episodeMarks(db, channelId, episodeId, MAX_EDL_EVENTS);
    const marks: MarkSpan[] = rows.flatMap((row) =>
      row.numerator && row.denominator ? [{ frames: Math.max(1, row.outFrame - row.inFrame), rate: { numerator: row.numerator, denominator: row.denominator }, note: row.note }] : [],
    );
    return { marks };
  },
};
