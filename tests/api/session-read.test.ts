import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { findLiveSession } from "../../server/auth/users.repository";
import { addMember, createChannel, createCrewedChannel, createUser } from "../factories/accounts";
import { startTestApp, type TestApp } from "../support/test-app";

/*
 * A signed-in request reads its session, its person and their roles in one query (findLiveSession),
 * and a channel route that names no rows is judged on those roles. Each request reads them anew: a
 * change made straight in the database counts from the next request.
 */
let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

const sql = (text: string, values: unknown[]) => app.database.pool.query(text, values);

async function sessionIdOf(userId: string): Promise<string> {
  const { rows } = await sql("select sid from session where user_id = $1", [userId]);
  return rows[0]!.sid;
}

describe("what a signed-in request reads first", () => {
  it("when a person's session is read, then it comes with their name and their role in each of their channels", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const other = await createChannel(app.db, await createUser(app.db, { name: "Uma Other" }));
    await addMember(app.db, other.id, owner, "crew");
    await app.signedIn(owner);

    const read = await findLiveSession(app.db, await sessionIdOf(owner.id));
    expect(read?.user).toMatchObject({ id: owner.id, name: owner.name, email: owner.email });
    expect(read?.roles).toEqual({ [channel.id]: "owner", [other.id]: "crew" });
    expect(await findLiveSession(app.db, "no-such-session")).toBeNull();
  });

  it("when a membership is removed and given back straight in the database, then the next request is judged on what is there now", async () => {
    const { channel, editor } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(editor);
    await agent.get(`/api/channels/${channel.id}/episodes`).expect(200);

    await sql("delete from memberships where channel_id = $1 and user_id = $2", [channel.id, editor.id]);
    await agent.get(`/api/channels/${channel.id}/episodes`).expect(404);

    await sql("insert into memberships (channel_id, user_id, role) values ($1, $2, 'crew')", [channel.id, editor.id]);
    await agent.get(`/api/channels/${channel.id}/episodes`).expect(200);
    await agent.send("post", `/api/channels/${channel.id}/episodes`, {}).expect(403);
  });

  it("when the person's name changes straight in the database, then the next request shows the new name", async () => {
    const person = await createUser(app.db, { name: "Vera Before" });
    const agent = await app.signedIn(person);
    expect((await agent.get("/api/auth/me").expect(200)).body.user.name).toBe("Vera Before");

    await sql("update users set name = 'Vera After' where id = $1", [person.id]);
    expect((await agent.get("/api/auth/me").expect(200)).body.user.name).toBe("Vera After");
  });

  it("when the session has expired in the database, then the request is signed out", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    await sql("update session set expire = now() - interval '1 second' where user_id = $1", [owner.id]);

    await agent.get(`/api/channels/${channel.id}/episodes`).expect(401);
    expect(await findLiveSession(app.db, await sessionIdOf(owner.id))).toBeNull();
  });
});
