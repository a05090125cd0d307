import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { DEMO_PASSWORD, demoAccounts, seedDemo } from "../../dev-services/demo/channel";
import type { Role } from "../../shared/access/roles";
import type { HomeView, NeedEntry, NeedGroup } from "../../shared/home/needs";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createHazard } from "../factories/bench";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

// The demo channel (dev-services/demo/) as each of its members finds it after signing in.
let app: TestApp;
let channelId: string;
const members = new Map<Role, Visitor>();

beforeAll(async () => {
  app = await startTestApp();
  await seedDemo(app.db);
  channelId = (await app.database.pool.query("select id from channels where name = 'Gantry Lane Workshop'")).rows[0].id;
  for (const account of demoAccounts) members.set(account.role, await app.signedIn({ email: account.email, password: DEMO_PASSWORD }));
});
afterAll(async () => {
  await app.close();
});

async function homeOf(role: Role): Promise<HomeView> {
  return (await members.get(role)!.get(`/api/channels/${channelId}/home`).expect(200)).body.home;
}

const entries = (home: HomeView, group: NeedGroup): NeedEntry[] => home.groups.find((g) => g.group === group)?.entries ?? [];
const titles = (home: HomeView, group: NeedGroup) => entries(home, group).map((entry) => entry.title);
/** Every word the home shows (labels, titles, details), without ids, keys and links: a random id may hold "fee". */
const everyWord = (home: HomeView) => home.groups.flatMap((group) => [group.label, ...group.entries.flatMap((entry) => [entry.title, entry.detail, entry.episode?.title ?? ""])]).join("\n");

describe("each member's home on the demo channel", () => {
  it("shows the host the episodes running late, the essentials missing before the next stage and the hazards not checked", async () => {
    const home = await homeOf("owner");
    expect(home.groups.map((g) => g.group)).toEqual(["at_risk", "gate_waiting", "hazard_to_check"]);
    expect(titles(home, "at_risk")).toContain("Two-stage bottle rocket");
    expect(entries(home, "at_risk").every((entry) => entry.tone === "alarm" && entry.href.endsWith("/overview"))).toBe(true);
    const gate = entries(home, "gate_waiting").find((entry) => entry.title === "Cheap and dear soldering irons, measured: before Publish")!;
    expect(gate.detail).toContain("must be approved or done before publishing");
    expect(gate.href).toBe(`/c/${channelId}/episodes/${gate.episode!.id}/sponsor-deals`);
    expect(titles(home, "hazard_to_check")).toEqual(["Over-voltage on motors and fans", "Flying near people or above the local height limit"]);
  });

  it("shows the producer sponsor items overdue, due soon, sent back with changes and waiting on the sponsor, each linked to the desk", async () => {
    const home = await homeOf("producer");
    expect(home.groups.map((g) => g.group)).toEqual(["sponsor_item", "at_risk"]);
    const items = entries(home, "sponsor_item");
    const detailOf = (title: string) => items.find((entry) => entry.title === title)?.detail;
    expect(detailOf("Copperleaf Tools: Draft cut of the segment to the sponsor")).toMatch(/late\.$/);
    expect(detailOf("Copperleaf Tools: Sponsor's final approval")).toContain("waits on the sponsor");
    expect(detailOf("Northbeam Bench Supplies: Sponsor approves the script")).toContain("changes were asked");
    expect(detailOf("Copperleaf Tools: Invoice the sponsor")).toContain("Due in the next 7 days");
    for (const entry of items) expect(entry.href).toBe(`/c/${channelId}/desk?episode=${entry.episode!.id}`);
  });

  it("shows the editor the segment cuts due and the clips not rated yet, and nothing about fees", async () => {
    const home = await homeOf("editor");
    expect(home.groups.map((g) => g.group)).toEqual(["cut_review", "unlogged_clip"]);
    expect(titles(home, "cut_review")).toEqual(["Copperleaf Tools: Draft cut of the segment to the sponsor", "Northbeam Bench Supplies: Draft cut of the segment to the sponsor"]);
    const clip = entries(home, "unlogged_clip")[0]!;
    expect(clip.title).toBe("BCAM_C007.MOV");
    expect(clip.href).toMatch(new RegExp(`^/c/${channelId}/rushes\\?clip=[0-9a-f-]{36}$`));
    expect(everyWord(home)).not.toMatch(/invoice|payment|fee/i);
  });

  it("shows crew today's shoot day in their own zone, its shots with the must-haves first, and the hazards to check", async () => {
    const home = await homeOf("crew");
    expect(home.timeZone).toBe("Europe/Oslo");
    expect(home.groups.map((g) => g.group)).toEqual(["shoot_today", "shot_to_get", "hazard_to_check"]);
    const [day] = entries(home, "shoot_today");
    expect(day).toMatchObject({ title: "Today: Thermal camera on a kite", date: home.today });
    expect(day!.detail).toContain("(you are on it)");
    expect(day!.href).toMatch(new RegExp(`^/c/${channelId}/shoot-days/[0-9a-f-]{36}$`));
    const shots = entries(home, "shot_to_get");
    expect(shots).toHaveLength(5);
    expect(shots.slice(0, 3).every((shot) => shot.detail.includes("Must have"))).toBe(true);
    expect(shots.every((shot) => shot.href === day!.href)).toBe(true);
    expect(titles(home, "hazard_to_check")).toHaveLength(2);
    expect(everyWord(home)).not.toMatch(/invoice|payment|fee|sponsor/i);
  });

  it("lets crew check a hazard at power-on, after which it leaves every home", async () => {
    const [hazard] = entries(await homeOf("crew"), "hazard_to_check");
    const path = hazard!.href.replace(`/c/${channelId}/episodes/`, "").replace("/test-plan", "");
    const crew = members.get("crew")!;
    const answer = await crew.send("put", `/api/channels/${channelId}/episodes/${path}/test-plan/hazards/${hazard!.key.split(":")[1]}/check`, { checked: true }).expect(200);
    expect(answer.body.hazard.checkedBy.name).toBe("Kwame Lindqvist");
    expect(titles(await homeOf("crew"), "hazard_to_check")).not.toContain(hazard!.title);
    expect(titles(await homeOf("owner"), "hazard_to_check")).not.toContain(hazard!.title);
  });

  it("refuses a check without a yes or no, and an editor's check, changing nothing", async () => {
    const { rows } = await app.database.pool.query("select h.id, h.episode_id from safety_hazards h where checked_at is null limit 1");
    const path = `/api/channels/${channelId}/episodes/${rows[0].episode_id}/test-plan/hazards/${rows[0].id}/check`;
    const bad = await members.get("crew")!.send("put", path, { checked: "yes" }).expect(400);
    expect(bad.body.error.fields.checked).toBe("Say whether the hazard is checked.");
    await members.get("editor")!.send("put", path, { checked: true }).expect(403);
    const after = await app.database.pool.query("select checked_at from safety_hazards where id = $1", [rows[0].id]);
    expect(after.rows[0].checked_at).toBeNull();
  });
});

describe("a home with nothing to do", () => {
  it("gives each group with no entries, so the page can say so", async () => {
    const world = await createCrewedChannel(app.db, "Quiet Channel");
    await createEpisode(app.db, world.channel.id, { title: "Idea only", stage: "challenge" });
    for (const person of [world.owner, world.producer, world.editor, world.crew]) {
      const member = await app.signedIn(person);
      const home: HomeView = (await member.get(`/api/channels/${world.channel.id}/home`).expect(200)).body.home;
      expect(home.groups.length).toBeGreaterThan(0);
      expect(home.groups.flatMap((g) => g.entries)).toEqual([]);
    }
  });

  it("never lists another channel's rows", async () => {
    const world = await createCrewedChannel(app.db, "Other Channel");
    const episode = await createEpisode(app.db, world.channel.id, { title: "Other build", stage: "build" });
    await createHazard(app.db, world.channel.id, episode.id);
    const home = await homeOf("crew");
    expect(everyWord(home)).not.toContain("Other build");
  });
});
