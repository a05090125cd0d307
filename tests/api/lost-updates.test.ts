import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { DealView } from "../../shared/sponsors/schemas";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createContact, createDeal, createSponsor } from "../factories/sponsors";
import { allRecipes, fillPath, makeAccessWorld } from "../support/access-world";
import { changedTables, tableFingerprints } from "../support/rows-snapshot";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";
import type { AccessWorld, Recipe } from "./access/matrix";

/*
 * Every record two people can edit at once carries a version; a save names the version it was made
 * against. When two people open the same record and both save, the second save answers 409 with the
 * record as it is now (the first person's values), in the one error shape, and changes nothing.
 */
const C = "/api/channels/:channelId";
const plan = `${C}/episodes/:episodeId/test-plan`;
const versionedSaves = [
  `PATCH ${C}/deals/:dealId`,
  `PUT ${C}/deals/:dealId/money`,
  `PUT ${C}/deals/:dealId/cut`,
  `PATCH ${C}/deliverables/:deliverableId`,
  `PUT ${plan}`,
  `PUT ${plan}/criteria/:criterionId`,
  `PUT ${C}/bench/parts/:partId`,
  `PUT ${C}/episodes/:episodeId/bench-runs/:runId`,
  `PUT ${C}/episodes/:episodeId/build-log/:iterationId`,
  `PATCH ${C}/sponsors/:sponsorId`,
  `PATCH ${C}/sponsors/:sponsorId/contacts/:contactId`,
  `PUT ${C}/deal-templates/:templateId`,
];

let app: TestApp;
let world: AccessWorld;
let recipes: Record<string, Recipe>;
let first: Visitor;
let second: Visitor;
beforeAll(async () => {
  app = await startTestApp();
  world = await makeAccessWorld(app);
  recipes = allRecipes(app, world);
  [first, second] = await Promise.all([app.signedIn(world.people.owner), app.signedIn(world.people.producer)]);
});
afterAll(() => app.close());

/** A fresh record through the route's recipe: its path, and the body of a save made against the version it has now. */
async function opened(route: string) {
  const [method, template] = route.split(" ") as [string, string];
  const prepared = (await recipes[route]!.prepare?.({ caller: "owner", person: world.people.owner })) ?? {};
  return { method: method.toLowerCase() as "put" | "patch", path: fillPath(template, { channelId: world.channel.id, ...prepared.params }), body: prepared.body as Record<string, unknown> };
}

describe("two people saving the same record", () => {
  it.each(versionedSaves)("when both save %s from the same version, then the second answers 409 with the first one's record and changes nothing", async (route) => {
    const record = await opened(route);
    const saved = await first.send(record.method, record.path, record.body);
    expect(saved.status, JSON.stringify(saved.body).slice(0, 300)).toBe(200);
    const before = await tableFingerprints(app);

    const stale = await second.send(record.method, record.path, record.body);
    expect(stale.status, JSON.stringify(stale.body).slice(0, 300)).toBe(409);
    expect(stale.body.error).toEqual({ code: "conflict", message: expect.stringMatching(/^Someone else changed this [a-z ]+ a moment ago\. You now see their version; make your change again if it still applies\.$/) });
    // The current record is the first save's answer, as it stands: the form can show it.
    expect(stale.body.current).toEqual(Object.values(saved.body)[0]);
    expect(changedTables(before, await tableFingerprints(app))).toEqual([]);
  });

  it.each(versionedSaves)("when %s is saved twice at the same moment from one version, then exactly one save lands", async (route) => {
    const record = await opened(route);
    const answers = await Promise.all([first.send(record.method, record.path, record.body), second.send(record.method, record.path, record.body)]);
    expect(answers.map((answer) => answer.status).sort()).toEqual([200, 409]);
  });

  it.each(versionedSaves)("when %s is sent without the version it was made against, then it answers 400 on that field", async (route) => {
    const record = await opened(route);
    const { version: _version, ...body } = record.body;
    const refused = await first.send(record.method, record.path, body).expect(400);
    expect(refused.body.error.fields).toMatchObject({ version: "Send the version you last saw." });
  });
});

describe("what a stale save shows", () => {
  it("when the producer saved the deal's script while the owner had the deal open, then the owner's save of the link answers 409 with the producer's script and their own link is not saved", async () => {
    const crewed = await createCrewedChannel(app.db, "Two Desks");
    const episode = await createEpisode(app.db, crewed.channel.id);
    const sponsor = await createSponsor(app.db, crewed.channel.id);
    await createContact(app.db, crewed.channel.id, sponsor.id);
    const { deal } = await createDeal(app.db, crewed.channel.id, episode.id, { sponsorId: sponsor.id, script: "First draft." });
    const [owner, producer] = await Promise.all([app.signedIn(crewed.owner), app.signedIn(crewed.producer)]);
    const path = `/api/channels/${crewed.channel.id}/deals/${deal.id}`;
    const seen = (await owner.get(path).expect(200)).body.deal as DealView;

    await producer.send("patch", path, { script: "Second draft, by the producer.", version: seen.version }).expect(200);
    const stale = await owner.send("patch", path, { link: "https://northbeam.example/new", version: seen.version }).expect(409);
    expect(stale.body.current).toMatchObject({ id: deal.id, version: seen.version + 1, script: "Second draft, by the producer.", link: "https://northbeam.example/gantry" });
    // The money stays with the roles that see fees, in a conflict too.
    expect(stale.body.current.money).toMatchObject({ fee: 4321 });
    const editor = await app.signedIn(crewed.editor);
    const editorStale = await editor.send("put", `${path}/cut`, { clipId: null, timing: null, version: seen.version }).expect(409);
    expect(editorStale.body.current).not.toHaveProperty("money");
  });

  it("when two people first save an episode's empty test plan, then the second answers 409 with the first one's sheet", async () => {
    const episode = await createEpisode(app.db, world.channel.id);
    const path = `/api/channels/${world.channel.id}/episodes/${episode.id}/test-plan`;
    expect((await first.get(path).expect(200)).body.plan.version).toBe(0);
    const sheet = { method: "", quantities: [], airframeMass: null, version: 0 };
    await first.send("put", path, { ...sheet, hypothesis: "It hovers for a minute." }).expect(200);
    const stale = await second.send("put", path, { ...sheet, hypothesis: "It hovers for two." }).expect(409);
    expect(stale.body.current).toMatchObject({ hypothesis: "It hovers for a minute.", version: 1 });
    const now = await second.send("put", path, { ...sheet, hypothesis: "It hovers for two.", version: 1 }).expect(200);
    expect(now.body.plan).toMatchObject({ hypothesis: "It hovers for two.", version: 2 });
  });
});
