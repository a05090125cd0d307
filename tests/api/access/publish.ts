import { expect } from "vitest";
import { publishThumbnails } from "../../../server/db/schema/publish";
import { createEpisode } from "../../factories/episodes";
import { ok, type AccessContext, type FeatureAccess, type Recipe } from "./matrix";

/*
 * The spec's role table, by hand: publish package: owner W, producer W, editor W, crew R.
 * "outsider" is the owner of another channel: 404, never 403.
 * The thumbnail upload takes a multipart form; the matrix sends none, so a caller let through meets the
 * form's own 400 ("choose a photo").
 */
const publish = "/api/channels/:channelId/episodes/:episodeId/publish";
const columns = "/api/channels/:channelId/publish/figure-columns";

export const access: FeatureAccess = {
  rows: [
    // route                                         visitor owner producer editor crew outsider
    [`GET ${publish}`,                                401,  ok,   ok,   ok,   ok,   404],
    [`PUT ${publish}`,                                401,  ok,   ok,   ok,   403,  404],
    [`POST ${publish}/go-live`,                       401,  ok,   ok,   ok,   403,  404],
    [`POST ${publish}/thumbnails`,                    401,  ok,   ok,   ok,   403,  404],
    [`DELETE ${publish}/thumbnails/:thumbnailId`,     401,  ok,   ok,   ok,   403,  404],
    [`GET ${publish}/figures`,                        401,  ok,   ok,   ok,   ok,   404],
    [`PUT ${publish}/figures/:day`,                   401,  ok,   ok,   ok,   403,  404],
    [`PUT ${columns}`,                                401,  ok,   ok,   ok,   403,  404],
  ],
  recipes: publishRecipes,
};

function publishRecipes({ app, world }: AccessContext): Record<string, Recipe> {
  const channelId = world.channel.id;
  const rows = async (sql: string, params: unknown[]) => (await app.database.pool.query(sql, params)).rows;
  const freshEpisode = () => createEpisode(app.db, channelId, { title: "Access episode", stage: "publish" });
  const count = async (table: string, column: string, value: string) => (await rows(`select 1 from ${table} where ${column} = $1`, [value])).length;
  const packageBody = { version: 0, titles: ["Matrix title"], chosenTitle: 0, description: "", chapters: "", timeZone: "UTC", publishAt: null, thumbnailId: null };

  return {
    [`GET ${publish}`]: { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    [`PUT ${publish}`]: {
      ok: 200,
      prepare: async () => {
        const episode = await freshEpisode();
        return { params: { episodeId: episode.id }, body: packageBody, intact: async () => expect(await count("publish_packages", "episode_id", episode.id)).toBe(0) };
      },
    },
    [`POST ${publish}/go-live`]: {
      ok: 200,
      prepare: async () => {
        const episode = await freshEpisode();
        return {
          params: { episodeId: episode.id },
          body: { videoUrl: "https://video.example/watch/matrix", reason: "Matrix check" },
          intact: async () => expect(await count("publish_packages", "episode_id", episode.id)).toBe(0),
        };
      },
    },
    [`GET ${publish}/figures`]: { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    [`PUT ${publish}/figures/:day`]: {
      ok: 200,
      prepare: async () => {
        const episode = await freshEpisode();
        await app.database.pool.query("insert into publish_packages (channel_id, episode_id, time_zone, published_at, video_url) values ($1, $2, 'UTC', now(), 'https://video.example/w')", [channelId, episode.id]);
        return {
          params: { episodeId: episode.id, day: "7" },
          body: { version: 0, source: "hand", values: { views: 10, watchHours: null, linkClicks: null, codeUses: null } },
          intact: async () => expect(await count("publish_figures", "episode_id", episode.id)).toBe(0),
        };
      },
    },
    [`PUT ${columns}`]: {
      ok: 200,
      prepare: async () => ({
        ...(await rows("delete from publish_figure_columns where channel_id = $1", [channelId]), {}),
        body: { video: "Content", views: "Views", watchHours: null, linkClicks: null, codeUses: null },
        intact: async () => expect(await count("publish_figure_columns", "channel_id", channelId)).toBe(0),
      }),
    },
    [`POST ${publish}/thumbnails`]: { ok: 400, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    [`DELETE ${publish}/thumbnails/:thumbnailId`]: {
      ok: 204,
      prepare: async () => {
        const episode = await freshEpisode();
        const [thumbnail] = await app.db
          .insert(publishThumbnails)
          .values({ channelId, episodeId: episode.id, objectKey: `${channelId}/${episode.id}/thumbnails/${crypto.randomUUID()}`, fileName: "t.png", contentType: "image/png", sizeBytes: 10 })
          .returning();
        return { params: { episodeId: episode.id, thumbnailId: thumbnail!.id }, intact: async () => expect(await count("publish_thumbnails", "id", thumbnail!.id)).toBe(1) };
      },
    },
  };
}
