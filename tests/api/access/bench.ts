import { randomUUID } from "node:crypto";
import { expect } from "vitest";
import { buildPhotos } from "../../../server/db/schema/bench";
import { createEpisode } from "../../factories/episodes";
import { createCriterion, createHazard, createIteration, createPart, createRun, q } from "../../factories/bench";
import { ok, type AccessContext, type FeatureAccess, type Recipe } from "./matrix";

/*
 * The spec's role table, by hand:
 * - test plan sheet: owner W, producer W, editor R, crew R;
 * - safety checks (a hazard checked before power-on): owner W, producer W, editor R, crew W;
 * - bench runs, bench shelf, build log: owner W, producer W, editor R, crew W.
 * "outsider" is the owner of another channel: 404, never 403.
 * The photo upload takes a multipart form; the matrix sends none, so a caller let through meets the
 * form's own 400 ("choose a photo").
 */
const plan = "/api/channels/:channelId/episodes/:episodeId/test-plan";
const parts = "/api/channels/:channelId/bench/parts";
const runs = "/api/channels/:channelId/episodes/:episodeId/bench-runs";
const log = "/api/channels/:channelId/episodes/:episodeId/build-log";
const photos = "/api/channels/:channelId/episodes/:episodeId/build-photos";
const card = "/api/channels/:channelId/episodes/:episodeId/results-card";
const colours = "/api/channels/:channelId/results-card-colours";

export const access: FeatureAccess = {
  rows: [
    // route                                         visitor owner producer editor crew outsider
    [`GET ${plan}`,                                   401,  ok,   ok,   ok,   ok,   404],
    [`PUT ${plan}`,                                   401,  ok,   ok,   403,  403,  404],
    [`POST ${plan}/criteria`,                         401,  ok,   ok,   403,  403,  404],
    [`PUT ${plan}/criteria/:criterionId`,             401,  ok,   ok,   403,  403,  404],
    [`DELETE ${plan}/criteria/:criterionId`,          401,  ok,   ok,   403,  403,  404],
    [`POST ${plan}/hazards`,                          401,  ok,   ok,   403,  403,  404],
    [`PATCH ${plan}/hazards/:hazardId`,               401,  ok,   ok,   403,  403,  404],
    [`PUT ${plan}/hazards/:hazardId/check`,           401,  ok,   ok,   403,  ok,   404],
    [`DELETE ${plan}/hazards/:hazardId`,              401,  ok,   ok,   403,  403,  404],
    [`GET ${parts}`,                                  401,  ok,   ok,   ok,   ok,   404],
    [`POST ${parts}`,                                 401,  ok,   ok,   403,  ok,   404],
    [`GET ${parts}/:partId`,                          401,  ok,   ok,   ok,   ok,   404],
    [`PUT ${parts}/:partId`,                          401,  ok,   ok,   403,  ok,   404],
    [`DELETE ${parts}/:partId`,                       401,  ok,   ok,   403,  ok,   404],
    [`GET ${runs}`,                                   401,  ok,   ok,   ok,   ok,   404],
    [`GET ${runs}.csv`,                               401,  ok,   ok,   ok,   ok,   404],
    [`POST ${runs}`,                                  401,  ok,   ok,   403,  ok,   404],
    [`PUT ${runs}/:runId`,                            401,  ok,   ok,   403,  ok,   404],
    [`DELETE ${runs}/:runId`,                         401,  ok,   ok,   403,  ok,   404],
    [`GET ${log}`,                                    401,  ok,   ok,   ok,   ok,   404],
    [`POST ${log}`,                                   401,  ok,   ok,   403,  ok,   404],
    [`PUT ${log}/:iterationId`,                       401,  ok,   ok,   403,  ok,   404],
    [`DELETE ${log}/:iterationId`,                    401,  ok,   ok,   403,  ok,   404],
    [`POST ${log}/:iterationId/photos`,               401,  ok,   ok,   403,  ok,   404],
    [`GET ${photos}`,                                 401,  ok,   ok,   ok,   ok,   404],
    [`DELETE ${photos}/:photoId`,                     401,  ok,   ok,   403,  ok,   404],
    [`GET ${card}`,                                   401,  ok,   ok,   ok,   ok,   404],
    [`POST ${card}`,                                  401,  ok,   ok,   403,  ok,   404],
    [`GET ${colours}`,                                401,  ok,   ok,   ok,   ok,   404],
    [`PUT ${colours}`,                                401,  ok,   ok,   ok,   403,  404],
  ],
  recipes: benchRecipes,
};

function benchRecipes({ app, world }: AccessContext): Record<string, Recipe> {
  const channelId = world.channel.id;
  const ownerId = world.owner.id;
  const rows = async (sql: string, params: unknown[]) => (await app.database.pool.query(sql, params)).rows;
  const freshEpisode = () => createEpisode(app.db, channelId, { title: "Access episode", stage: "test_plan" });
  const checkHazard: Recipe = {
      ok: 200,
      prepare: async () => {
        const episode = await freshEpisode();
        const hazard = await createHazard(app.db, channelId, episode.id);
        return {
          params: { episodeId: episode.id, hazardId: hazard.id },
          body: { checked: true },
          intact: async () => expect(await rows("select checked_by from safety_hazards where id = $1", [hazard.id])).toEqual([{ checked_by: null }]),
        };
      },
  };

  const criterionBody = { metric: "thrust", comparator: "gte", threshold: q(700, "gf"), required: true };
  const partBody = { name: "Matrix motor", kind: "motor", mass: q(68, "g"), ratedVoltage: q(16.8, "V"), ratedCurrent: null, price: null, supplier: "", notes: "" };
  const runBody = { label: "Matrix run", parts: [], supply: { kind: "lipo", cells: 3 }, measurements: { thrust: q(760, "gf") }, notes: "" };
  const iterationBody = { change: "Matrix change", allUpMass: q(600, "g"), outcome: "worked", chosenRunId: null, notes: "" };

  const count = async (table: string, column: string, value: string) => (await rows(`select 1 from ${table} where ${column} = $1`, [value])).length;

  return {
    [`GET ${plan}`]: { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    [`PUT ${plan}`]: {
      ok: 200,
      prepare: async () => {
        const episode = await freshEpisode();
        return {
          params: { episodeId: episode.id },
          // Version 0: the episode has no sheet yet.
          body: { hypothesis: "Matrix hypothesis", method: "", quantities: [], airframeMass: null, version: 0 },
          intact: async () => expect(await count("test_plans", "episode_id", episode.id)).toBe(0),
        };
      },
    },
    [`POST ${plan}/criteria`]: {
      ok: 201,
      prepare: async () => {
        const episode = await freshEpisode();
        return { params: { episodeId: episode.id }, body: criterionBody, intact: async () => expect(await count("test_criteria", "episode_id", episode.id)).toBe(0) };
      },
    },
    [`PUT ${plan}/criteria/:criterionId`]: {
      ok: 200,
      prepare: async () => {
        const episode = await freshEpisode();
        const criterion = await createCriterion(app.db, channelId, episode.id);
        return {
          params: { episodeId: episode.id, criterionId: criterion.id },
          body: { ...criterionBody, version: 1 },
          intact: async () => expect((await rows("select definition->>'metric' as metric from test_criteria where id = $1", [criterion.id]))[0]?.metric).toBe("thrust_to_weight"),
        };
      },
    },
    [`DELETE ${plan}/criteria/:criterionId`]: {
      ok: 204,
      prepare: async () => {
        const episode = await freshEpisode();
        const criterion = await createCriterion(app.db, channelId, episode.id);
        return { params: { episodeId: episode.id, criterionId: criterion.id }, intact: async () => expect(await count("test_criteria", "id", criterion.id)).toBe(1) };
      },
    },
    [`POST ${plan}/hazards`]: {
      ok: 201,
      prepare: async () => {
        const episode = await freshEpisode();
        return {
          params: { episodeId: episode.id },
          body: { kind: "mains", mitigation: "Enclosed supply only." },
          intact: async () => expect(await count("safety_hazards", "episode_id", episode.id)).toBe(0),
        };
      },
    },
    // Checking a hazard, through the plan's edit or at power-on: a refused check leaves it unchecked.
    [`PATCH ${plan}/hazards/:hazardId`]: checkHazard,
    [`PUT ${plan}/hazards/:hazardId/check`]: checkHazard,
    [`DELETE ${plan}/hazards/:hazardId`]: {
      ok: 204,
      prepare: async () => {
        const episode = await freshEpisode();
        const hazard = await createHazard(app.db, channelId, episode.id);
        return { params: { episodeId: episode.id, hazardId: hazard.id }, intact: async () => expect(await count("safety_hazards", "id", hazard.id)).toBe(1) };
      },
    },
    [`GET ${parts}`]: { ok: 200 },
    [`POST ${parts}`]: {
      ok: 201,
      prepare: async () => {
        const name = `Matrix motor ${randomUUID().slice(0, 8)}`;
        return { body: { ...partBody, name }, intact: async () => expect(await count("bench_parts", "name", name)).toBe(0) };
      },
    },
    [`GET ${parts}/:partId`]: {
      ok: 200,
      prepare: async () => ({ params: { partId: (await createPart(app.db, channelId)).id } }),
    },
    [`PUT ${parts}/:partId`]: {
      ok: 200,
      prepare: async () => {
        const part = await createPart(app.db, channelId, { name: "Before" });
        return {
          params: { partId: part.id },
          body: { ...partBody, name: "After", version: 1 },
          intact: async () => expect(await rows("select name from bench_parts where id = $1", [part.id])).toEqual([{ name: "Before" }]),
        };
      },
    },
    [`DELETE ${parts}/:partId`]: {
      ok: 204,
      prepare: async () => {
        const part = await createPart(app.db, channelId);
        return { params: { partId: part.id }, intact: async () => expect(await count("bench_parts", "id", part.id)).toBe(1) };
      },
    },
    [`GET ${runs}`]: { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    [`GET ${runs}.csv`]: { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    [`POST ${runs}`]: {
      ok: 201,
      prepare: async () => {
        const episode = await freshEpisode();
        return { params: { episodeId: episode.id }, body: runBody, intact: async () => expect(await count("bench_runs", "episode_id", episode.id)).toBe(0) };
      },
    },
    [`PUT ${runs}/:runId`]: {
      ok: 200,
      prepare: async () => {
        const episode = await freshEpisode();
        const run = await createRun(app.db, channelId, episode.id, ownerId, { label: "Before" });
        return {
          params: { episodeId: episode.id, runId: run.id },
          body: { ...runBody, version: 1 },
          intact: async () => expect(await rows("select label from bench_runs where id = $1", [run.id])).toEqual([{ label: "Before" }]),
        };
      },
    },
    [`DELETE ${runs}/:runId`]: {
      ok: 204,
      prepare: async () => {
        const episode = await freshEpisode();
        const run = await createRun(app.db, channelId, episode.id, ownerId);
        return { params: { episodeId: episode.id, runId: run.id }, intact: async () => expect(await count("bench_runs", "id", run.id)).toBe(1) };
      },
    },
    [`GET ${log}`]: { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    [`POST ${log}`]: {
      ok: 201,
      prepare: async () => {
        const episode = await freshEpisode();
        return { params: { episodeId: episode.id }, body: iterationBody, intact: async () => expect(await count("build_iterations", "episode_id", episode.id)).toBe(0) };
      },
    },
    [`PUT ${log}/:iterationId`]: {
      ok: 200,
      prepare: async () => {
        const episode = await freshEpisode();
        const iteration = await createIteration(app.db, channelId, episode.id, ownerId, { change: "Before" });
        return {
          params: { episodeId: episode.id, iterationId: iteration.id },
          body: { ...iterationBody, version: 1 },
          intact: async () => expect(await rows("select change from build_iterations where id = $1", [iteration.id])).toEqual([{ change: "Before" }]),
        };
      },
    },
    [`DELETE ${log}/:iterationId`]: {
      ok: 204,
      prepare: async () => {
        const episode = await freshEpisode();
        const iteration = await createIteration(app.db, channelId, episode.id, ownerId);
        return { params: { episodeId: episode.id, iterationId: iteration.id }, intact: async () => expect(await count("build_iterations", "id", iteration.id)).toBe(1) };
      },
    },
    [`POST ${log}/:iterationId/photos`]: {
      ok: 400,
      prepare: async () => {
        const iteration = await createIteration(app.db, channelId, world.episode.id, ownerId);
        return { params: { episodeId: world.episode.id, iterationId: iteration.id } };
      },
    },
    [`GET ${photos}`]: { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    [`DELETE ${photos}/:photoId`]: {
      ok: 204,
      prepare: async () => {
        const episode = await freshEpisode();
        const iteration = await createIteration(app.db, channelId, episode.id, ownerId);
        const [photo] = await app.db
          .insert(buildPhotos)
          .values({ channelId, episodeId: episode.id, iterationId: iteration.id, objectKey: `${channelId}/${episode.id}/${randomUUID()}`, fileName: "m.jpg", contentType: "image/jpeg", sizeBytes: 4 })
          .returning();
        return { params: { episodeId: episode.id, photoId: photo!.id }, intact: async () => expect(await count("build_photos", "id", photo!.id)).toBe(1) };
      },
    },
    [`GET ${card}`]: { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    [`POST ${card}`]: {
      ok: 202,
      prepare: async () => {
        const episode = await freshEpisode();
        await createRun(app.db, channelId, episode.id, ownerId, { label: "Card run" });
        return { params: { episodeId: episode.id }, intact: async () => expect(await count("bench_results_cards", "episode_id", episode.id)).toBe(0) };
      },
    },
    [`GET ${colours}`]: { ok: 200 },
    [`PUT ${colours}`]: {
      ok: 200,
      prepare: async () => {
        // Each cell starts from Kerf's own colours, whoever set them in a cell before.
        await rows("update channels set card_colours = null where id = $1", [channelId]);
        return {
          body: { colours: { background: "#102030", ink: "#f0f0f0", accent: "#f2b33d" } },
          intact: async () => expect((await rows("select card_colours from channels where id = $1", [channelId]))[0]?.card_colours).toBeNull(),
        };
      },
    },
  };
}
