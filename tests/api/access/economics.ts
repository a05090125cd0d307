import { expect } from "vitest";
import { createEntry } from "../../factories/economics";
import { createEpisode } from "../../factories/episodes";
import { createDeal, createSponsor } from "../../factories/sponsors";
import { ok, type AccessContext, type FeatureAccess, type Recipe } from "./matrix";

/*
 * The spec's role table, by hand: "costs and income of episodes": owner W, producer W, editor —, crew —.
 * "outsider" is the owner of another channel: 404, never 403.
 * The receipt upload takes a multipart form; the matrix sends none, so a caller let through meets the
 * form's own 400 ("choose a photo").
 */
const episodeMoney = "/api/channels/:channelId/episodes/:episodeId/money";
const channelMoney = "/api/channels/:channelId/money";

export const access: FeatureAccess = {
  rows: [
    // route                                            visitor owner producer editor crew outsider
    [`GET ${episodeMoney}`,                              401,  ok,   ok,   403,  403,  404],
    [`POST ${episodeMoney}/entries`,                     401,  ok,   ok,   403,  403,  404],
    [`DELETE ${episodeMoney}/entries/:entryId`,          401,  ok,   ok,   403,  403,  404],
    [`POST ${episodeMoney}/entries/:entryId/receipt`,    401,  ok,   ok,   403,  403,  404],
    [`PUT ${episodeMoney}/deals/:dealId/rate`,           401,  ok,   ok,   403,  403,  404],
    [`GET ${channelMoney}`,                              401,  ok,   ok,   403,  403,  404],
    [`GET ${channelMoney}.csv`,                          401,  ok,   ok,   403,  403,  404],
    [`PUT ${channelMoney}/settings`,                     401,  ok,   ok,   403,  403,  404],
  ],
  recipes: economicsRecipes,
};

function economicsRecipes({ app, world }: AccessContext): Record<string, Recipe> {
  const channelId = world.channel.id;
  const rows = async (sql: string, params: unknown[]) => (await app.database.pool.query(sql, params)).rows;
  const count = async (sql: string, params: unknown[]) => (await rows(sql, params)).length;
  const freshEpisode = () => createEpisode(app.db, channelId, { title: "Access money episode" });
  const purchase = { kind: "purchase", category: "travel", label: "Matrix train fare", source: "", amount: "42.50", currency: "EUR", occurredOn: "2027-03-04", rate: "" };

  return {
    [`GET ${episodeMoney}`]: { ok: 200, prepare: async () => ({ params: { episodeId: world.episode.id } }) },
    [`POST ${episodeMoney}/entries`]: {
      ok: 201,
      prepare: async () => {
        const episode = await freshEpisode();
        return { params: { episodeId: episode.id }, body: purchase, intact: async () => expect(await count("select 1 from money_entries where episode_id = $1", [episode.id])).toBe(0) };
      },
    },
    [`DELETE ${episodeMoney}/entries/:entryId`]: {
      ok: 204,
      prepare: async () => {
        const episode = await freshEpisode();
        const entry = await createEntry(app.db, channelId, episode.id);
        return { params: { episodeId: episode.id, entryId: entry.id }, intact: async () => expect(await count("select 1 from money_entries where id = $1", [entry.id])).toBe(1) };
      },
    },
    [`POST ${episodeMoney}/entries/:entryId/receipt`]: {
      ok: 400,
      prepare: async () => {
        const entry = await createEntry(app.db, channelId, world.episode.id);
        return { params: { episodeId: world.episode.id, entryId: entry.id } };
      },
    },
    [`PUT ${episodeMoney}/deals/:dealId/rate`]: {
      ok: 204,
      prepare: async () => {
        const episode = await freshEpisode();
        const sponsor = await createSponsor(app.db, channelId);
        const { deal } = await createDeal(app.db, channelId, episode.id, { sponsorId: sponsor.id, currency: "USD", items: [] });
        return { params: { episodeId: episode.id, dealId: deal.id }, body: { rate: "0.92" }, intact: async () => expect(await count("select 1 from deal_fee_rates where deal_id = $1", [deal.id])).toBe(0) };
      },
    },
    [`GET ${channelMoney}`]: { ok: 200 },
    [`GET ${channelMoney}.csv`]: { ok: 200 },
    [`PUT ${channelMoney}/settings`]: {
      ok: 200,
      // Only the hourly rate changes: the matrix channel may already hold money, which fixes its currency.
      prepare: async () => {
        const [current] = await rows("select version, currency from money_settings where channel_id = $1", [channelId]);
        const version = (current?.version as number | undefined) ?? 0;
        return {
          body: { currency: (current?.currency as string | undefined) ?? "EUR", hourRate: "40", version },
          intact: async () => expect(((await rows("select version from money_settings where channel_id = $1", [channelId]))[0]?.version as number | undefined) ?? 0).toBe(version),
        };
      },
    },
  };
}
