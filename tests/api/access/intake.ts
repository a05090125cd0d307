import { createHash, randomUUID } from "node:crypto";
import { expect } from "vitest";
import { intakeContacts, intakeIdeas, intakeSuggestions } from "../../../server/db/schema/intake";
import { newsTokens } from "../../../server/intake/news-token";
import { ok, type AccessContext, type FeatureAccess, type Recipe } from "./matrix";

/*
 * Viewers' suggestions (issue 17), by hand: any member reads, enters, groups and weighs ideas
 * ("entry by hand by any member"); the public page's settings and comment imports are the owner's
 * and producers'; putting an idea on the slate makes an episode, so it needs episodes W (crew R).
 * The public page and the links mailed to viewers need no account: everyone, the outsider too, is let through.
 */
const pages = "/api/suggestion-pages/:channelId";
const base = "/api/channels/:channelId/intake";
const idea = `${base}/ideas/:ideaId`;

export const access: FeatureAccess = {
  rows: [
    // route                                      visitor owner producer editor crew outsider
    [`GET ${pages}`,                              ok,   ok,   ok,   ok,   ok,   ok],
    [`POST ${pages}/suggestions`,                 ok,   ok,   ok,   ok,   ok,   ok],
    ["POST /api/suggestion-addresses/confirm",    ok,   ok,   ok,   ok,   ok,   ok],
    ["POST /api/suggestion-addresses/stop",       ok,   ok,   ok,   ok,   ok,   ok],
    [`GET ${base}/page`,                          401,  ok,   ok,   ok,   ok,   404],
    [`PUT ${base}/page`,                          401,  ok,   ok,   403,  403,  404],
    [`GET ${base}/ideas`,                         401,  ok,   ok,   ok,   ok,   404],
    [`GET ${idea}`,                               401,  ok,   ok,   ok,   ok,   404],
    [`POST ${base}/suggestions`,                  401,  ok,   ok,   ok,   ok,   404],
    [`POST ${idea}/merge`,                        401,  ok,   ok,   ok,   ok,   404],
    [`POST ${base}/suggestions/:suggestionId/split`, 401, ok,  ok,   ok,   ok,   404],
    [`PUT ${idea}/judgement`,                     401,  ok,   ok,   ok,   ok,   404],
    [`PUT ${idea}/wording`,                       401,  ok,   ok,   ok,   ok,   404],
    [`POST ${idea}/decline`,                      401,  ok,   ok,   ok,   ok,   404],
    [`POST ${idea}/park`,                         401,  ok,   ok,   ok,   ok,   404],
    [`POST ${idea}/reopen`,                       401,  ok,   ok,   ok,   ok,   404],
    [`POST ${idea}/promote`,                      401,  ok,   ok,   ok,   403,  404],
    [`POST ${base}/imports/preview`,              401,  ok,   ok,   403,  403,  404],
    [`POST ${base}/imports`,                      401,  ok,   ok,   403,  403,  404],
  ],
  recipes: intakeRecipes,
};

function intakeRecipes({ app, world }: AccessContext): Record<string, Recipe> {
  const channelId = world.channel.id;
  const pool = app.database.pool;
  const tokens = newsTokens(app.deps.env.SESSION_SECRET);
  /** An idea holding `count` suggestions, each a fresh wording no other cell uses. */
  const freshIdea = async (count = 1) => {
    const words = `Matrix ask ${randomUUID()}`;
    const [row] = await app.db.insert(intakeIdeas).values({ channelId, wording: words }).returning();
    const suggestions = await app.db
      .insert(intakeSuggestions)
      .values(Array.from({ length: count }, (_, i) => ({ channelId, ideaId: row!.id, text: `${words} ${i}`, source: "hand" as const, personKey: `matrix:${randomUUID()}` })))
      .returning();
    return { ideaId: row!.id, suggestionIds: suggestions.map((s) => s.id) };
  };
  const statusOf = async (ideaId: string) => (await pool.query("select status from intake_ideas where id = $1", [ideaId])).rows[0]?.status as string | undefined;
  const stillOpen = (ideaId: string) => async () => expect(await statusOf(ideaId)).toBe("open");
  const freshContact = async () => {
    const [row] = await app.db.insert(intakeContacts).values({ channelId, email: `${randomUUID()}@example.com` }).returning();
    return row!;
  };
  const csv = (text: string) => ({ csv: `Comment\r\n${text}\r\n`, mapping: { text: "Comment" } });
  const importedNothing = (text: string) => async () => expect((await pool.query("select 1 from intake_suggestions where text = $1", [text])).rowCount).toBe(0);
  const openPage = () => pool.query("insert into intake_pages (channel_id, open, prompt) values ($1, true, 'Ask away') on conflict (channel_id) do update set open = true", [channelId]);
  const ideaCell = (ok: number, body?: object): Recipe => ({
    ok,
    prepare: async () => {
      const { ideaId } = await freshIdea();
      return { params: { ideaId }, body, intact: stillOpen(ideaId) };
    },
  });

  return {
    [`GET ${pages}`]: { ok: 200, prepare: async () => (await openPage(), {}) },
    [`POST ${pages}/suggestions`]: {
      ok: 201,
      prepare: async () => {
        await openPage();
        // Every cell calls from the same address: its allowance starts afresh for each.
        await pool.query("delete from intake_page_hits");
        return { body: { text: `A matrix ask ${randomUUID()}` } };
      },
    },
    ["POST /api/suggestion-addresses/confirm"]: {
      ok: 200,
      prepare: async () => {
        const contact = await freshContact();
        const token = randomUUID() + randomUUID();
        await pool.query("update intake_contacts set confirm_hash = $2 where id = $1", [contact.id, createHash("sha256").update(token).digest("hex")]);
        return { body: { token } };
      },
    },
    ["POST /api/suggestion-addresses/stop"]: { ok: 200, prepare: async () => ({ body: { token: tokens.make((await freshContact()).id) } }) },
    [`GET ${base}/page`]: { ok: 200 },
    [`PUT ${base}/page`]: {
      ok: 200,
      prepare: async () => {
        await pool.query("delete from intake_pages where channel_id = $1", [channelId]);
        return { body: { open: false, prompt: "Matrix prompt" }, intact: async () => expect((await pool.query("select 1 from intake_pages where channel_id = $1", [channelId])).rowCount).toBe(0) };
      },
    },
    [`GET ${base}/ideas`]: { ok: 200 },
    [`GET ${idea}`]: ideaCell(200),
    [`POST ${base}/suggestions`]: { ok: 201, prepare: async () => ({ body: { text: `Typed in ${randomUUID()}` } }) },
    [`POST ${idea}/merge`]: {
      ok: 200,
      prepare: async () => {
        const [kept, folded] = [await freshIdea(), await freshIdea()];
        return { params: { ideaId: kept.ideaId }, body: { otherIdeaId: folded.ideaId }, intact: stillOpen(folded.ideaId) };
      },
    },
    [`POST ${base}/suggestions/:suggestionId/split`]: {
      ok: 201,
      prepare: async () => {
        const { suggestionIds } = await freshIdea(2);
        return { params: { suggestionId: suggestionIds[1]! } };
      },
    },
    [`PUT ${idea}/judgement`]: ideaCell(200, { draw: 2, reach: 2, spend: 1, danger: 3 }),
    [`PUT ${idea}/wording`]: ideaCell(200, { wording: "Matrix wording" }),
    [`POST ${idea}/decline`]: ideaCell(200, { reason: "Matrix reason" }),
    [`POST ${idea}/park`]: ideaCell(200),
    [`POST ${idea}/reopen`]: ideaCell(200),
    [`POST ${idea}/promote`]: ideaCell(201),
    [`POST ${base}/imports/preview`]: { ok: 200, prepare: async () => ({ body: csv("Matrix preview") }) },
    [`POST ${base}/imports`]: {
      ok: 201,
      prepare: async () => {
        const text = `Matrix import ${randomUUID()}`;
        return { body: csv(text), intact: importedNothing(text) };
      },
    },
  };
}
