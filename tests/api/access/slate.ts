import { expect } from "vitest";
import { defaultStageLengths } from "../../../shared/slate/schedule";
import { createEpisode } from "../../factories/episodes";
import { ok, type AccessContext, type FeatureAccess, type Recipe } from "./matrix";

/*
 * The slate: episodes (fields, stage moves, schedule) owner, producer and editor W, crew R;
 * comments everyone W; stage lengths are channel settings: owner W, producer R, editor and crew
 * nothing (the spec's "members, invitations, channel settings" row). The board and the episode page
 * (GET …/episodes, GET …/episodes/:episodeId) are in foundation.ts.
 */
export const access: FeatureAccess = {
  rows: [
    // route                                                             visitor owner producer editor crew outsider
    ["POST /api/channels/:channelId/episodes",                            401,  ok,   ok,   ok,   403,  404],
    ["PATCH /api/channels/:channelId/episodes/:episodeId",                401,  ok,   ok,   ok,   403,  404],
    ["POST /api/channels/:channelId/episodes/:episodeId/move",            401,  ok,   ok,   ok,   403,  404],
    ["POST /api/channels/:channelId/episodes/:episodeId/archive",         401,  ok,   ok,   ok,   403,  404],
    ["POST /api/channels/:channelId/episodes/:episodeId/restore",         401,  ok,   ok,   ok,   403,  404],
    ["PUT /api/channels/:channelId/episodes/:episodeId/due-dates/:stage", 401,  ok,   ok,   ok,   403,  404],
    ["GET /api/channels/:channelId/episodes/:episodeId/history",          401,  ok,   ok,   ok,   ok,   404],
    ["GET /api/channels/:channelId/episodes/:episodeId/comments",         401,  ok,   ok,   ok,   ok,   404],
    ["POST /api/channels/:channelId/episodes/:episodeId/comments",        401,  ok,   ok,   ok,   ok,   404],
    ["GET /api/channels/:channelId/slate/people",                         401,  ok,   ok,   ok,   ok,   404],
    ["GET /api/channels/:channelId/episode-titles",                       401,  ok,   ok,   ok,   ok,   404],
    ["GET /api/channels/:channelId/slate/settings",                       401,  ok,   ok,   403,  403,  404],
    ["PUT /api/channels/:channelId/slate/settings",                       401,  ok,   403,  403,  403,  404],
  ],
  recipes: slateRecipes,
};

function slateRecipes({ app, world }: AccessContext): Record<string, Recipe> {
  const q = (text: string, values: unknown[]) => app.database.pool.query(text, values);
  const episodeRow = async (id: string) => (await q("select stage, version, title, archived_at from episodes where id = $1", [id])).rows[0];

  /** A fresh episode for one cell, and the check that a refused write left it as it was. */
  async function fresh(overrides: Parameters<typeof createEpisode>[2] = {}) {
    const episode = await createEpisode(app.db, world.channel.id, { title: "Matrix card", ...overrides });
    const before = await episodeRow(episode.id);
    return { episode, intact: async () => expect(await episodeRow(episode.id)).toEqual(before) };
  }
  const versioned = (overrides: Parameters<typeof createEpisode>[2], body: object) => async () => {
    const { episode, intact } = await fresh(overrides);
    return { params: { episodeId: episode.id }, body: { version: episode.version, ...body }, intact };
  };

  return {
    "POST /api/channels/:channelId/episodes": {
      ok: 201,
      prepare: async () => {
        const title = `Matrix new ${Math.random().toString(36).slice(2, 8)}`;
        return {
          body: { title, question: "", origin: "idea", originLink: "", whyWorthIt: "", ownerId: "", tags: [], budgetAmount: "", budgetCurrency: "", targetPublishDate: "" },
          intact: async () => expect((await q("select 1 from episodes where title = $1", [title])).rowCount).toBe(0),
        };
      },
    },
    "GET /api/channels/:channelId/episode-titles": { ok: 200 },
    "PATCH /api/channels/:channelId/episodes/:episodeId": { ok: 200, prepare: versioned({}, { title: "Changed by the matrix" }) },
    "POST /api/channels/:channelId/episodes/:episodeId/move": { ok: 200, prepare: versioned({}, { stage: "test_plan" }) },
    "POST /api/channels/:channelId/episodes/:episodeId/archive": { ok: 200, prepare: versioned({}, {}) },
    "POST /api/channels/:channelId/episodes/:episodeId/restore": { ok: 200, prepare: versioned({ archivedAt: new Date() }, {}) },
    "PUT /api/channels/:channelId/episodes/:episodeId/due-dates/:stage": {
      ok: 200,
      prepare: async () => {
        const { episode, intact } = await fresh({ targetPublishDate: "2027-03-05" });
        return {
          params: { episodeId: episode.id, stage: "build" },
          body: { version: episode.version, dueDate: "2027-02-26" },
          intact: async () => {
            await intact();
            expect((await q("select 1 from due_overrides where episode_id = $1", [episode.id])).rowCount).toBe(0);
          },
        };
      },
    },
    "GET /api/channels/:channelId/episodes/:episodeId/history": { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    "GET /api/channels/:channelId/episodes/:episodeId/comments": { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    "POST /api/channels/:channelId/episodes/:episodeId/comments": {
      ok: 201,
      prepare: async () => {
        const { episode } = await fresh();
        return {
          params: { episodeId: episode.id },
          body: { body: "A note from the matrix." },
          intact: async () => expect((await q("select 1 from episode_comments where episode_id = $1", [episode.id])).rowCount).toBe(0),
        };
      },
    },
    "GET /api/channels/:channelId/slate/people": { ok: 200 },
    "GET /api/channels/:channelId/slate/settings": { ok: 200 },
    "PUT /api/channels/:channelId/slate/settings": {
      ok: 200,
      prepare: async () => {
        const before = (await q("select stage_lengths from slate_channels where channel_id = $1", [world.channel.id])).rows[0]?.stage_lengths ?? null;
        return {
          body: { stageLengths: { ...defaultStageLengths, edit: 9 } },
          intact: async () => expect((await q("select stage_lengths from slate_channels where channel_id = $1", [world.channel.id])).rows[0]?.stage_lengths ?? null).toEqual(before),
        };
      },
    },
  };
}
