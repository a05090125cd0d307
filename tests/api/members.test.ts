import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { addMember, createChannel, createCrewedChannel, createUser } from "../factories/accounts";
import { uniqueEmail } from "../factories/invitations";
import { startTestApp, type TestApp } from "../support/test-app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

async function roleIn(channelId: string, userId: string): Promise<string | null> {
  const result = await app.database.pool.query<{ role: string }>("select role from memberships where channel_id = $1 and user_id = $2", [
    channelId,
    userId,
  ]);
  return result.rows[0]?.role ?? null;
}

describe("managing members", () => {
  it("when the owner changes a member's role, then the members list shows the new role", async () => {
    const { channel, owner, editor } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);

    const changed = await agent.send("patch", `/api/channels/${channel.id}/members/${editor.id}`, { role: "producer" }).expect(200);
    expect(changed.body).toEqual({ userId: editor.id, role: "producer" });
    const members = await agent.get(`/api/channels/${channel.id}/members`).expect(200);
    expect(members.body.members).toEqual(expect.arrayContaining([expect.objectContaining({ userId: editor.id, role: "producer" })]));
    expect(await roleIn(channel.id, editor.id)).toBe("producer");
  });

  it("when the owner removes a member, then that person no longer sees the channel", async () => {
    const { channel, owner, crew } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const crewAgent = await app.signedIn(crew);
    await crewAgent.get(`/api/channels/${channel.id}/episodes`).expect(200);

    await agent.send("delete", `/api/channels/${channel.id}/members/${crew.id}`).expect(204);

    const members = await agent.get(`/api/channels/${channel.id}/members`).expect(200);
    expect(members.body.members.map((m: { userId: string }) => m.userId)).not.toContain(crew.id);
    await crewAgent.get(`/api/channels/${channel.id}/episodes`).expect(404);
    expect((await crewAgent.get("/api/auth/me").expect(200)).body.memberships).toEqual([]);
  });

  it("when the only owner would be demoted or removed, then it answers 422 and the owner stays", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);

    const demote = await agent.send("patch", `/api/channels/${channel.id}/members/${owner.id}`, { role: "editor" }).expect(422);
    expect(demote.body.error).toMatchObject({ code: "unprocessable", message: expect.stringMatching(/owner/) });
    const remove = await agent.send("delete", `/api/channels/${channel.id}/members/${owner.id}`).expect(422);
    expect(remove.body.error.code).toBe("unprocessable");
    expect(await roleIn(channel.id, owner.id)).toBe("owner");
  });

  it("when a channel has two owners, then one can be demoted, and the one left cannot", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const second = await createUser(app.db, { name: "Sol Second" });
    await addMember(app.db, channel.id, second, "owner");
    const agent = await app.signedIn(owner);

    await agent.send("patch", `/api/channels/${channel.id}/members/${second.id}`, { role: "producer" }).expect(200);
    expect(await roleIn(channel.id, second.id)).toBe("producer");
    await agent.send("patch", `/api/channels/${channel.id}/members/${owner.id}`, { role: "producer" }).expect(422);
    expect(await roleIn(channel.id, owner.id)).toBe("owner");
  });

  it("when a channel has two owners, then one owner may leave", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const second = await createUser(app.db);
    await addMember(app.db, channel.id, second, "owner");
    const agent = await app.signedIn(owner);

    await agent.send("delete", `/api/channels/${channel.id}/members/${owner.id}`).expect(204);
    expect(await roleIn(channel.id, owner.id)).toBeNull();
    expect(await roleIn(channel.id, second.id)).toBe("owner");
  });

  it("when the role is not one of the four, then it answers 400 and nothing changes", async () => {
    const { channel, owner, crew } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const response = await agent.send("patch", `/api/channels/${channel.id}/members/${crew.id}`, { role: "admin" }).expect(400);
    expect(response.body.error.fields).toEqual({ role: "Pick one of owner, producer, editor or crew." });
    expect(await roleIn(channel.id, crew.id)).toBe("crew");
  });

  it("when the person is not a member of the channel, then changing or removing them answers 404", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const stranger = await createUser(app.db);
    const agent = await app.signedIn(owner);
    await agent.send("patch", `/api/channels/${channel.id}/members/${stranger.id}`, { role: "crew" }).expect(404);
    await agent.send("delete", `/api/channels/${channel.id}/members/${stranger.id}`).expect(404);
    expect(await roleIn(channel.id, stranger.id)).toBeNull();
  });
});

describe("who may see and manage members", () => {
  it("when a producer opens the members list, then they may read it but not invite", async () => {
    const { channel, producer, crew } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(producer);

    const members = await agent.get(`/api/channels/${channel.id}/members`).expect(200);
    expect(members.body.members).toHaveLength(4);
    expect(members.body.invitations).toEqual([]);

    const invite = await agent.send("post", `/api/channels/${channel.id}/invitations`, { email: uniqueEmail("by-producer"), role: "crew" }).expect(403);
    expect(invite.body.error.code).toBe("forbidden");
    await agent.send("patch", `/api/channels/${channel.id}/members/${crew.id}`, { role: "editor" }).expect(403);
    await agent.send("delete", `/api/channels/${channel.id}/members/${crew.id}`).expect(403);

    const stored = await app.database.pool.query("select 1 from invitations where channel_id = $1", [channel.id]);
    expect(stored.rowCount).toBe(0);
    expect(await roleIn(channel.id, crew.id)).toBe("crew");
  });

  it("when an editor or crew member opens the members list, then it answers 403", async () => {
    const { channel, editor, crew } = await createCrewedChannel(app.db);
    for (const person of [editor, crew]) {
      const response = await (await app.signedIn(person)).get(`/api/channels/${channel.id}/members`).expect(403);
      expect(response.body.error.code).toBe("forbidden");
    }
  });

  it("when one account belongs to two channels, then me lists both with the role in each", async () => {
    const person = await createUser(app.db);
    const own = await createChannel(app.db, person, "Alpha Rig");
    const { channel: other } = await createCrewedChannel(app.db, "Beta Bench");
    await addMember(app.db, other.id, person, "producer");

    const me = await (await app.signedIn(person)).get("/api/auth/me").expect(200);
    expect(me.body.memberships).toEqual([
      { channelId: own.id, channelName: "Alpha Rig", role: "owner" },
      { channelId: other.id, channelName: "Beta Bench", role: "producer" },
    ]);
  });
});
