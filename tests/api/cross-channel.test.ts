import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createChannel, createCrewedChannel, createUser } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createInvitation, uniqueEmail } from "../factories/invitations";
import { startTestApp, type TestApp } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

/** Two channels that share nobody: A with an episode, B with its own owner and episode. */
async function twoChannels() {
  const a = await createCrewedChannel(app.db, "Channel A");
  const episodeOfA = await createEpisode(app.db, a.channel.id, { title: "A's secret build" });
  const ownerOfB = await createUser(app.db, { name: "Bo Owner" });
  const channelB = await createChannel(app.db, ownerOfB, "Channel B");
  const episodeOfB = await createEpisode(app.db, channelB.id, { title: "B's own episode" });
  return { a, episodeOfA, ownerOfB, channelB, episodeOfB, agentOfB: await app.signedIn(ownerOfB) };
}

describe("nothing of one channel is visible from another", () => {
  it("when a B member reads A's episode through B's URL, then it answers 404", async () => {
    const { episodeOfA, channelB, episodeOfB, agentOfB } = await twoChannels();
    // Control: the same route with B's own episode works.
    await agentOfB.get(`/api/channels/${channelB.id}/episodes/${episodeOfB.id}`).expect(200);

    const response = await agentOfB.get(`/api/channels/${channelB.id}/episodes/${episodeOfA.id}`).expect(404);
    expect(response.body.error.code).toBe("not_found");
    expect(JSON.stringify(response.body)).not.toContain("secret build");

    const list = await agentOfB.get(`/api/channels/${channelB.id}/episodes`).expect(200);
    expect(list.body.episodes.map((e: { id: string }) => e.id)).toEqual([episodeOfB.id]);
  });

  it("when a B member reads A's episode through A's URL, then it answers 404, not 403", async () => {
    const { a, episodeOfA, agentOfB } = await twoChannels();
    for (const path of [`/api/channels/${a.channel.id}/episodes/${episodeOfA.id}`, `/api/channels/${a.channel.id}/episodes`, `/api/channels/${a.channel.id}/members`]) {
      const response = await agentOfB.get(path).expect(404);
      expect(response.body.error.code).toBe("not_found");
    }
    // Control: A's own crew reads it.
    await (await app.signedIn(a.crew)).get(`/api/channels/${a.channel.id}/episodes/${episodeOfA.id}`).expect(200);
  });

  it("when B's owner aims member and invitation changes at A's rows through B's URL, then they answer 404 and change nothing", async () => {
    const { a, channelB, agentOfB } = await twoChannels();
    const invitationOfA = await createInvitation(app.db, { channelId: a.channel.id, invitedBy: a.owner });

    await agentOfB.send("patch", `/api/channels/${channelB.id}/members/${a.editor.id}`, { role: "crew" }).expect(404);
    await agentOfB.send("delete", `/api/channels/${channelB.id}/members/${a.editor.id}`).expect(404);
    await agentOfB.send("delete", `/api/channels/${channelB.id}/invitations/${invitationOfA.id}`).expect(404);

    const editor = await app.database.pool.query("select role from memberships where channel_id = $1 and user_id = $2", [a.channel.id, a.editor.id]);
    expect(editor.rows).toEqual([{ role: "editor" }]);
    const invitation = await app.database.pool.query("select revoked_at from invitations where id = $1", [invitationOfA.id]);
    expect(invitation.rows).toEqual([{ revoked_at: null }]);
  });

  it("when a B owner writes to A's URL, then it answers 404 and A is untouched", async () => {
    const { a, agentOfB } = await twoChannels();
    await agentOfB.send("patch", `/api/channels/${a.channel.id}/members/${a.editor.id}`, { role: "owner" }).expect(404);
    await agentOfB.send("post", `/api/channels/${a.channel.id}/invitations`, { email: uniqueEmail("sneaky"), role: "owner" }).expect(404);
    const rows = await app.database.pool.query("select 1 from invitations where channel_id = $1", [a.channel.id]);
    expect(rows.rowCount).toBe(0);
  });
});

describe("ids that cannot name a row", () => {
  it("when an id is malformed, then it answers 404", async () => {
    const { a, episodeOfA } = await twoChannels();
    const agent = await app.signedIn(a.owner);
    const malformed = ["not-a-uuid", "123", `${episodeOfA.id}x`, "' or '1'='1", "00000000-0000-0000-0000-00000000000g"];
    for (const bad of malformed) {
      const asEpisode = await agent.get(`/api/channels/${a.channel.id}/episodes/${encodeURIComponent(bad)}`).expect(404);
      expect(asEpisode.body.error.code).toBe("not_found");
      const asChannel = await agent.get(`/api/channels/${encodeURIComponent(bad)}/episodes`).expect(404);
      expect(asChannel.body.error.code).toBe("not_found");
      await agent.send("delete", `/api/channels/${a.channel.id}/members/${encodeURIComponent(bad)}`).expect(404);
      await agent.send("delete", `/api/channels/${a.channel.id}/invitations/${encodeURIComponent(bad)}`).expect(404);
    }
  });

  it("when an id is well formed but names nothing, then it answers 404", async () => {
    const { a } = await twoChannels();
    const agent = await app.signedIn(a.owner);
    const noEpisode = await agent.get(`/api/channels/${a.channel.id}/episodes/${randomUUID()}`).expect(404);
    const noChannel = await agent.get(`/api/channels/${randomUUID()}/episodes`).expect(404);
    expect([noEpisode.body.error.code, noChannel.body.error.code]).toEqual(["not_found", "not_found"]);
  });

  it("when an id is written in capitals, then it names the same episode", async () => {
    const { a, episodeOfA } = await twoChannels();
    const agent = await app.signedIn(a.owner);
    const response = await agent.get(`/api/channels/${a.channel.id.toUpperCase()}/episodes/${episodeOfA.id.toUpperCase()}`).expect(200);
    expect(response.body.episode.id).toBe(episodeOfA.id);
  });
});
