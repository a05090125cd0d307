import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCrewedChannel, createUser } from "../factories/accounts";
import { mailJobsTo, waitForQueueToSettle } from "../support/jobs";
import { mailTo, waitForMail } from "../support/mailbox";
import { startTestApp, type TestApp } from "../support/test-app";
import { newEpisode } from "./slate-support";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

describe("comments with mentions", () => {
  it("when a comment mentions two members, then both get an e-mail with a link, and the author none", async () => {
    const { channel, owner, editor, crew } = await createCrewedChannel(app.db, "Gantry Test Channel");
    const made = await newEpisode(await app.signedIn(owner), channel.id, { title: "Relay calculator" });
    const agent = await app.signedIn(crew);
    const posted = await agent
      .send("post", `/api/channels/${channel.id}/episodes/${made.id}/comments`, { body: "@Edda Editor the relay shot is in. @olive owner can we reshoot the carry? (cc @Cato Crew)" })
      .expect(201);
    expect(posted.body.comment).toMatchObject({ authorName: "Cato Crew", mentions: [{ id: editor.id, name: "Edda Editor" }, { id: owner.id, name: "Olive Owner" }, { id: crew.id, name: "Cato Crew" }] });

    const mail = await waitForMail(editor.email);
    expect(mail.subject).toBe("Cato Crew mentioned you on “Relay calculator”");
    expect(mail.text).toContain("the relay shot is in");
    expect(mail.text).toContain("Gantry Test Channel");
    expect(mail.text).toContain(`http://kerf.test/c/${channel.id}/episodes/${made.id}#activity`);
    await waitForMail(owner.email);
    // The author: no mail was queued, and with every mail job finished, none arrived.
    expect(await mailJobsTo(app.database.pool, crew.email)).toEqual([]);
    await waitForQueueToSettle(app.database.pool);
    expect(await mailTo(crew.email)).toEqual([]);

    const listed = await (await app.signedIn(owner)).get(`/api/channels/${channel.id}/episodes/${made.id}/comments`).expect(200);
    expect(listed.body.comments).toEqual([expect.objectContaining({ id: posted.body.comment.id, body: posted.body.comment.body, authorId: crew.id })]);
  });

  it("when a comment names someone outside the channel, then nobody outside is mailed", async () => {
    const { channel, owner, editor } = await createCrewedChannel(app.db);
    const outsider = await createUser(app.db, { name: "Rafa Outside" });
    const made = await newEpisode(await app.signedIn(owner), channel.id);
    const posted = await (await app.signedIn(owner))
      .send("post", `/api/channels/${channel.id}/episodes/${made.id}/comments`, { body: "@Rafa Outside, thoughts? And @Edda Editor too." })
      .expect(201);
    expect(posted.body.comment.mentions).toEqual([{ id: editor.id, name: "Edda Editor" }]);
    expect(await mailJobsTo(app.database.pool, outsider.email)).toEqual([]);
    // The member named beside them is mailed; once that job has finished, nothing reached the outsider.
    await waitForMail(editor.email);
    await waitForQueueToSettle(app.database.pool);
    expect(await mailTo(outsider.email)).toEqual([]);
  });

  it("when a comment is empty or too long, then it says so and nothing is saved", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const agent = await app.signedIn(owner);
    const made = await newEpisode(agent, channel.id);
    const empty = await agent.send("post", `/api/channels/${channel.id}/episodes/${made.id}/comments`, { body: "   " }).expect(400);
    expect(empty.body.error.fields).toEqual({ body: "Write a comment first." });
    await agent.send("post", `/api/channels/${channel.id}/episodes/${made.id}/comments`, { body: "x".repeat(4001) }).expect(400);
    expect((await agent.get(`/api/channels/${channel.id}/episodes/${made.id}/comments`).expect(200)).body.comments).toEqual([]);
  });
});
