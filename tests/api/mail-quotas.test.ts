import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { connectDatabase, type DatabaseHandle } from "../../server/db/client";
import { addMember, createChannel, createCrewedChannel, createUser } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { uniqueEmail } from "../factories/invitations";
import { createContact, createDeal, createSponsor } from "../factories/sponsors";
import { createTestDatabase, type TestDatabase } from "../support/database";
import { mailTo } from "../support/mailbox";
import { startTestApp, type TestApp } from "../support/test-app";
import { newEpisode } from "./slate-support";

/*
 * Two app instances on one database: an allowance is counted in PostgreSQL, so sending through either
 * draws on the same count. The limits are the real ones (server/mail/quotas.ts); a test that needs an
 * allowance spent records the earlier sends straight in the table, as the server would have.
 */
let database: TestDatabase;
let instances: TestApp[] = [];
let handle: DatabaseHandle;

beforeAll(async () => {
  database = await createTestDatabase();
  instances = [await startTestApp({ database }), await startTestApp({ database })];
  handle = connectDatabase(database.url);
});
afterAll(async () => {
  for (const app of instances) await app.close();
  await handle.close();
  await database.drop();
});

async function spend(scope: string, mails: number) {
  await database.pool.query("insert into mail_quota_uses (scope, mails, sent_at) values ($1, $2, now() - interval '10 minutes')", [scope, mails]);
}

const count = async (sql: string, values: unknown[]) => (await database.pool.query<{ n: number }>(sql, values)).rows[0]!.n;

describe("allowances on outbound mail", () => {
  it("when one person sends thirty invitations through two instances, then the thirty-first answers 429 saying when, and nothing is stored or sent", async () => {
    const owner = await createUser(handle.db, { name: "Quinn Quota" });
    const channel = await createChannel(handle.db, owner, "Busy Bench");
    const agents = await Promise.all(instances.map((app) => app.signedIn(owner)));
    for (let i = 0; i < 30; i++) {
      await agents[i % 2]!.send("post", `/api/channels/${channel.id}/invitations`, { email: uniqueEmail(`crew${i}`), role: "crew" }).expect(201);
    }
    const extra = uniqueEmail("one-too-many");
    const refused = await agents[0]!.send("post", `/api/channels/${channel.id}/invitations`, { email: extra, role: "crew" }).expect(429);
    expect(refused.body.error).toMatchObject({ code: "rate_limited" });
    expect(refused.body.error.message).toMatch(/^Kerf sends at most 30 invitations an hour for one person.*Nothing was sent; try again after \d\d:\d\d UTC \(in (\d+ minutes?|1 hour)\)\.$/);
    expect(refused.body.retryAfterSeconds).toBeGreaterThan(3000);
    // The same wait in HTTP's own header (RFC 9110, section 10.2.3: delay-seconds).
    expect(refused.headers["retry-after"]).toBe(String(refused.body.retryAfterSeconds));
    expect(await count("select count(*)::int as n from invitations where email = $1", [extra])).toBe(0);
    expect(await count("select count(*)::int as n from invitations where channel_id = $1", [channel.id])).toBe(30);
  }, 60_000);

  it("when a channel has used its day's invitations, then another owner of it is refused too, and an owner elsewhere is not", async () => {
    const first = await createUser(handle.db);
    const channel = await createChannel(handle.db, first, "Spent Channel");
    const second = await createUser(handle.db);
    await addMember(handle.db, channel.id, second, "owner");
    await spend(`channel:${channel.id}:invitation`, 60);

    const refused = await (await instances[1]!.signedIn(second)).send("post", `/api/channels/${channel.id}/invitations`, { email: uniqueEmail("x"), role: "crew" }).expect(429);
    expect(refused.body.error.message).toMatch(/^Kerf sends at most 60 invitations a day for one channel/);
    expect(refused.body.retryAfterSeconds).toBeGreaterThan(23 * 3600);

    const elsewhere = await createChannel(handle.db, second, "Other Bench");
    await (await instances[0]!.signedIn(second)).send("post", `/api/channels/${elsewhere.id}/invitations`, { email: uniqueEmail("y"), role: "crew" }).expect(201);
  });

  it("when a comment would mail more mentioned people than the author's hour allows, then it answers 429 and the comment is not saved", async () => {
    const { channel, owner, editor } = await createCrewedChannel(handle.db, "Chatty Channel");
    const agent = await instances[0]!.signedIn(owner);
    const episode = await newEpisode(agent, channel.id);
    await spend(`account:${owner.id}:mention`, 60);

    const path = `/api/channels/${channel.id}/episodes/${episode.id}/comments`;
    const refused = await agent.send("post", path, { body: "@Edda Editor one more look?" }).expect(429);
    expect(refused.body.error.message).toMatch(/^Kerf sends at most 60 mails about mentions an hour for one person/);
    expect(await count("select count(*)::int as n from episode_comments where episode_id = $1", [episode.id])).toBe(0);
    expect(await mailTo(editor.email)).toEqual([]);
    // A comment that mentions nobody sends no mail and needs no allowance.
    await agent.send("post", path, { body: "Noted for the next shoot." }).expect(201);
  });

  it("when a producer has sent thirty review links this hour, then the next answers 429 and the item stays as it was", async () => {
    const { channel, producer } = await createCrewedChannel(handle.db, "Review Quota");
    await spend(`account:${producer.id}:review_link`, 30);
    const episode = await createEpisode(handle.db, channel.id, { targetPublishDate: "2027-06-01" });
    const sponsor = await createSponsor(handle.db, channel.id);
    const contact = await createContact(handle.db, channel.id, sponsor.id);
    const deal = await createDeal(handle.db, channel.id, episode.id, { sponsorId: sponsor.id, contactId: contact.id, publishDate: "2027-06-01" });
    const item = deal.items.find((i) => i.kind === "script_approval")!;

    const agent = await instances[1]!.signedIn(producer);
    const refused = await agent.send("post", `/api/channels/${channel.id}/deals/${deal.deal.id}/review-links`, { deliverableId: item.id, contactId: contact.id }).expect(429);
    expect(refused.body.error.message).toMatch(/^Kerf sends at most 30 review links an hour for one person/);
    expect(await count("select count(*)::int as n from review_links where deal_id = $1", [deal.deal.id])).toBe(0);
    expect((await database.pool.query("select status::text from deliverables where id = $1", [item.id])).rows[0].status).toBe(item.status);
  });
});
