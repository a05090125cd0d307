import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { addDays, formatISO } from "date-fns";
import type { Role } from "../../shared/access/roles";
import type { Stage } from "../../shared/slate/stages";
import type { DeskView } from "../../shared/sponsors/schemas";
import { seedSponsorsDemo } from "../../dev-services/demo/sponsors";
import type { DemoContext } from "../../dev-services/demo/context";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { startTestApp, type TestApp } from "../support/test-app";

let app: TestApp;
let world: Awaited<ReturnType<typeof createCrewedChannel>>;

// The demo's sponsor rows on the demo's episodes (titles and publish dates as in dev-services/demo/channel.ts).
const demoEpisodes: [Stage, string, number][] = [
  ["sponsor_read", "Cheap and dear soldering irons, measured", 4],
  ["edit", "Relay calculator", 9],
  ["test_plan", "Solar-only espresso", 60],
  ["shoot", "Two-stage bottle rocket", 12],
];

beforeAll(async () => {
  app = await startTestApp();
  world = await createCrewedChannel(app.db, "Demo Copy");
  const today = new Date();
  const episodes: DemoContext["episodes"] = [];
  for (const [stage, title, days] of demoEpisodes) {
    const e = await createEpisode(app.db, world.channel.id, { stage, title, targetPublishDate: formatISO(addDays(today, days), { representation: "date" }) });
    episodes.push({ id: e.id, stage, title, targetPublishDate: e.targetPublishDate });
  }
  const people = new Map<Role, { id: string; email: string; name: string }>([
    ["owner", world.owner],
    ["producer", world.producer],
    ["editor", world.editor],
    ["crew", world.crew],
  ]);
  await seedSponsorsDemo({ db: app.db, today, channelId: world.channel.id, people, episodes });
});
afterAll(async () => {
  await app.close();
});

describe("the sponsors demo", () => {
  it("has three sponsors and four deals in different states", async () => {
    const producer = await app.signedIn(world.producer);
    const sponsors = (await producer.get(`/api/channels/${world.channel.id}/sponsors`).expect(200)).body.sponsors;
    expect(sponsors).toHaveLength(3);
    const states = await app.database.pool.query("select state::text, count(*)::int as n from deals group by state order by state::text");
    expect(states.rows).toEqual([
      { state: "cancelled", n: 1 },
      { state: "negotiating", n: 1 },
      { state: "signed", n: 2 },
    ]);
  });

  it("shows an overdue item, one waiting on the sponsor behind an open link, and recorded approvals", async () => {
    const producer = await app.signedIn(world.producer);
    const desk = (await producer.get(`/api/channels/${world.channel.id}/desk`).expect(200)).body as DeskView;
    expect(desk.counts.overdue).toBeGreaterThanOrEqual(1);
    expect(desk.items.filter((i) => i.group === "waiting").map((i) => i.title)).toEqual(["Sponsor's final approval"]);
    const links = await app.database.pool.query("select decision::text, (revoked_at is null and decided_at is null and expires_at > now()) as open from review_links order by created_at");
    expect(links.rows.filter((l) => l.open)).toHaveLength(1);
    expect(links.rows.filter((l) => l.decision === "approved").length).toBeGreaterThanOrEqual(1);
  });
});
