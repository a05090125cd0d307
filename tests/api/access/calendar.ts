import { createHash, randomBytes } from "node:crypto";
import { and, eq, isNull } from "drizzle-orm";
import { calendarFeeds } from "../../../server/db/schema/calendar";
import type { FeatureAccess } from "./matrix";
import { ok } from "./matrix";

/*
 * The calendar: every member reads it (all read episodes); what each role sees in it follows each
 * source's own area (tests/api/calendar.test.ts). A publish-date preview is for those who may move the
 * date (episodes W). Each member makes and ends their own feed; the account page lists theirs. A feed's
 * address is public: its secret is the only key ("outsider" and "visitor" fetch a live one).
 */
const c = "/api/channels/:channelId";
const feed = `${c}/calendar-feed`;
const ics = "/api/calendar-feeds/:token/kerf.ics";

export const access: FeatureAccess = {
  rows: [
    // route                                                     visitor owner producer editor crew outsider
    [`GET ${c}/calendar`,                                         401,  ok,   ok,   ok,   ok,   404],
    [`POST ${c}/calendar/episodes/:episodeId/publish-preview`,    401,  ok,   ok,   ok,   403,  404],
    ["GET /api/account/calendar-feeds",                           401,  ok,   ok,   ok,   ok,   ok],
    [`POST ${feed}`,                                              401,  ok,   ok,   ok,   ok,   404],
    [`DELETE ${feed}`,                                            401,  ok,   ok,   ok,   ok,   404],
    [`GET ${ics}`,                                                ok,   ok,   ok,   ok,   ok,   ok],
  ],
  recipes: ({ app, world }) => {
    /** A person's live feed in the matrix channel (the one before it ended), made in the database: its secret for the address. */
    const liveFeed = async (userId: string) => {
      await app.db.update(calendarFeeds).set({ revokedAt: new Date() }).where(and(eq(calendarFeeds.channelId, world.channel.id), eq(calendarFeeds.userId, userId), isNull(calendarFeeds.revokedAt)));
      const token = randomBytes(32).toString("base64url");
      await app.db.insert(calendarFeeds).values({ channelId: world.channel.id, userId, tokenHash: createHash("sha256").update(token).digest("hex"), scope: "everything" });
      return token;
    };
    return {
      // The matrix names no days, so a caller let through meets the range's own 400.
      [`GET ${c}/calendar`]: { ok: 400 },
      [`POST ${c}/calendar/episodes/:episodeId/publish-preview`]: { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id }, body: { date: "2031-05-09" } }) },
      ["GET /api/account/calendar-feeds"]: { ok: 200 },
      [`POST ${feed}`]: { ok: 201, prepare: async () => ({ body: { scope: "mine" } }) },
      [`DELETE ${feed}`]: {
        ok: 204,
        prepare: async ({ person }) => {
          if (person) await liveFeed(person.id);
          return {};
        },
      },
      [`GET ${ics}`]: { ok: 200, prepare: async () => ({ params: { token: await liveFeed(world.owner.id) } }) },
    };
  },
};
