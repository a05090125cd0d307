import { execFile } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { eq } from "drizzle-orm";
import ICAL from "ical.js";
import request from "supertest";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { CalendarView, PublishMovePreview } from "../../shared/calendar/entries";
import type { TemplateItem } from "../../shared/sponsors/deliverables";
import { deliverables } from "../../server/db/schema/sponsors";
import { episodes } from "../../server/db/schema/slate";
import { publishPackages } from "../../server/db/schema/publish";
import { shootDayCrew } from "../../server/db/schema/rushes";
import { createChannel, createCrewedChannel, createUser } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createShootDay } from "../factories/rushes";
import { createDeal, createSponsor } from "../factories/sponsors";
import { startTestApp, type TestApp, type Visitor } from "../support/test-app";

const run = promisify(execFile);
let app: TestApp;
let world: Awaited<ReturnType<typeof createCrewedChannel>>;
const as: Record<"owner" | "producer" | "editor" | "crew", Visitor> = {} as never;
let rotor: { id: string };
let hinge: { id: string };

const items: TemplateItem[] = [
  { kind: "script_draft", title: "Script draft to the sponsor", anchor: "before_publish", offsetDays: 10, ownerRole: null },
  { kind: "invoice", title: "Invoice the sponsor", anchor: "before_publish", offsetDays: 2, ownerRole: null },
  { kind: "report", title: "Figures after a week", anchor: "before_publish", offsetDays: 0, ownerRole: null },
];

beforeAll(async () => {
  app = await startTestApp();
  world = await createCrewedChannel(app.db, "Calendar Channel");
  for (const role of ["owner", "producer", "editor", "crew"] as const) as[role] = await app.signedIn(world[role]);
  rotor = await createEpisode(app.db, world.channel.id, { title: "Nine-inch rotor", targetPublishDate: "2031-05-16", ownerId: world.owner.id });
  hinge = await createEpisode(app.db, world.channel.id, { title: "Hinge torture test", targetPublishDate: "2031-05-16", ownerId: world.producer.id });
  const sponsor = await createSponsor(app.db, world.channel.id, { company: "Lathe & Co" });
  await createDeal(app.db, world.channel.id, rotor.id, { sponsorId: sponsor.id, publishDate: "2031-05-16", items, fee: "9876.00", currency: "EUR", ownerId: world.producer.id });
  // The rotor's shoot stage is due well before 16 May; this shoot day is after it, and the crew member is booked twice on the 14th.
  const late = await createShootDay(app.db, world.channel.id, rotor.id, { day: "2031-05-14", place: "Yard" });
  const other = await createShootDay(app.db, world.channel.id, hinge.id, { day: "2031-05-14", place: "Bench" });
  await app.db.insert(shootDayCrew).values([
    { shootDayId: late.id, userId: world.crew.id },
    { shootDayId: other.id, userId: world.crew.id },
  ]);
});
afterAll(async () => {
  await app.close();
});

const c = () => `/api/channels/${world.channel.id}`;
async function view(role: keyof typeof as, from = "2031-04-01", to = "2031-05-31"): Promise<CalendarView> {
  return (await as[role].get(`${c()}/calendar?from=${from}&to=${to}`).expect(200)).body.calendar;
}
const find = (v: CalendarView, key: string) => v.entries.find((e) => e.key === key);

describe("the calendar", () => {
  it("gathers publish days, stage due dates, shoot days and sponsor items, each linked to its place", async () => {
    const v = await view("owner");
    const publish = find(v, `publish:${rotor.id}`)!;
    expect(publish).toMatchObject({ kind: "publish", day: "2031-05-16", href: `/c/${world.channel.id}/episodes/${rotor.id}/overview`, people: [world.owner.id] });
    expect(publish.episodeVersion).toBe(1);
    expect(find(v, `stage_due:${rotor.id}:shoot`)?.kind).toBe("stage_due");
    const shoot = v.entries.filter((e) => e.kind === "shoot");
    expect(shoot.map((e) => e.href)).toContain(`/c/${world.channel.id}/episodes/${rotor.id}/shoot`);
    const script = v.entries.find((e) => e.title === "Lathe & Co: Script draft to the sponsor")!;
    expect(script).toMatchObject({ kind: "deliverable", day: "2031-05-06", sponsorName: "Lathe & Co", href: `/c/${world.channel.id}/episodes/${rotor.id}/sponsor-deals` });
    expect(v.entries.find((e) => e.title.endsWith("Figures after a week"))?.kind).toBe("figures");
    expect(v.entries.find((e) => e.title.endsWith("Invoice the sponsor"))?.fee).toEqual({ amount: "9876.00", currency: "EUR" });
    expect(v.members.map((m) => m.name)).toContain("Cato Crew");
  });

  it("never shows money to the editor or crew: no invoice items and no fee anywhere in the answer", async () => {
    for (const role of ["editor", "crew"] as const) {
      const v = await view(role);
      expect(v.entries.some((e) => e.title.endsWith("Script draft to the sponsor"))).toBe(true);
      expect(v.entries.some((e) => e.title.endsWith("Invoice the sponsor"))).toBe(false);
      expect(JSON.stringify(v)).not.toContain("9876");
      expect(v.entries.every((e) => e.fee === null)).toBe(true);
    }
  });

  it("marks two publishes a day, a shoot day past its deadline and a member booked twice", async () => {
    const v = await view("producer");
    expect(v.conflicts[`publish:${rotor.id}`]).toEqual(["Another episode publishes this day too: “Hinge torture test”."]);
    const shootKeys = v.entries.filter((e) => e.kind === "shoot" && e.episodeId === rotor.id).map((e) => e.key);
    const marks = v.conflicts[shootKeys[0]!]!;
    expect(marks.some((m) => m.startsWith("Shoots after the shoot stage is due ("))).toBe(true);
    expect(marks).toContain("Cato Crew is booked on two shoot days this day.");
  });

  it("answers a bad or too long range with 400 and names the field", async () => {
    const bad = await as.owner.get(`${c()}/calendar?from=2031-13-01&to=2031-05-01`).expect(400);
    expect(Object.keys(bad.body.error.fields)).toContain("from");
    const long = await as.owner.get(`${c()}/calendar?from=2031-01-01&to=2031-12-31`).expect(400);
    expect(long.body.error.fields.to).toMatch(/at most/);
    await as.owner.get(`${c()}/calendar?from=2031-05-02&to=2031-05-01`).expect(400);
  });
});

describe("a publish-date move, previewed", () => {
  it("lists the stage due dates and sponsor items that would move with it and saves nothing", async () => {
    const before = await app.db.select().from(deliverables).where(eq(deliverables.channelId, world.channel.id));
    const res = await as.producer.send("post", `${c()}/calendar/episodes/${rotor.id}/publish-preview`, { date: "2031-05-23" }).expect(200);
    const preview: PublishMovePreview = res.body.preview;
    expect(preview).toMatchObject({ episodeId: rotor.id, from: "2031-05-16", to: "2031-05-23" });
    const moved = new Map(preview.moved.map((m) => [m.title, m]));
    expect(moved.get("Publish: Nine-inch rotor")).toMatchObject({ from: "2031-05-16", to: "2031-05-23" });
    expect(moved.get("Lathe & Co: Script draft to the sponsor")).toMatchObject({ from: "2031-05-06", to: "2031-05-13" });
    expect(preview.moved.some((m) => m.kind === "stage_due")).toBe(true);
    // The two-publishes clash goes away; the shoot day is still after its deadline, which moved a week.
    expect(preview.newConflicts).toEqual(["Shoots after the shoot stage is due (Thu 8 May 2031)."]);
    const [episode] = await app.db.select().from(episodes).where(eq(episodes.id, rotor.id));
    expect(episode).toMatchObject({ targetPublishDate: "2031-05-16", version: 1 });
    expect(await app.db.select().from(deliverables).where(eq(deliverables.channelId, world.channel.id))).toEqual(before);
  });

  it("names a conflict the move would make", async () => {
    const res = await as.owner.send("post", `${c()}/calendar/episodes/${hinge.id}/publish-preview`, { date: "2031-05-13" }).expect(200);
    expect(res.body.preview.newConflicts.some((m: string) => m.startsWith("Shoots after the episode publishes"))).toBe(true);
  });

  it("refuses another channel's episode with 404 and a bad date with 400", async () => {
    const stranger = await createUser(app.db);
    const elsewhere = await createChannel(app.db, stranger, "Elsewhere");
    const theirs = await createEpisode(app.db, elsewhere.id, { targetPublishDate: "2031-05-16" });
    await as.owner.send("post", `${c()}/calendar/episodes/${theirs.id}/publish-preview`, { date: "2031-05-20" }).expect(404);
    await as.owner.send("post", `${c()}/calendar/episodes/${rotor.id}/publish-preview`, { date: "soon" }).expect(400);
  });
});

// ---------------------------------------------------------------------------------------------------
// Feeds. Readers: ical.js 2.2.1 (npm) and Python's icalendar 4.0.3 (Debian's python3-icalendar), neither
// written here. The rules checked are RFC 5545's: 3.1 (lines of at most 75 octets, folded with CRLF and a
// space, never splitting a UTF-8 character), 3.3.4 (DATE), 3.6.1 (an all-day VEVENT's DTEND is the day
// after, exclusive), 3.8.4.7 (UID), 3.8.7.4 (SEQUENCE), 3.8.7.2 (DTSTAMP in UTC), 3.8.1.11 (STATUS:CANCELLED).
// ---------------------------------------------------------------------------------------------------

async function newFeed(who: Visitor, scope: "everything" | "mine") {
  const res = await who.send("post", `${c()}/calendar-feed`, { scope }).expect(201);
  return { url: res.body.feed.url as string, path: new URL(res.body.feed.url).pathname };
}

/** The feed's bytes as sent, fetched by someone with no session (a calendar app). */
const fetchFeed = (feedPath: string) =>
  request(app.server)
    .get(feedPath)
    .buffer(true)
    .parse((r, done) => {
      const chunks: Buffer[] = [];
      r.on("data", (chunk: Buffer) => chunks.push(chunk));
      r.on("end", () => done(null, Buffer.concat(chunks)));
    });

function icalEvents(text: string) {
  const root = new ICAL.Component(ICAL.parse(text));
  return root.getAllSubcomponents("vevent").map((v) => ({ event: new ICAL.Event(v), component: v }));
}

async function pythonEvents(text: string) {
  const file = path.join(mkdtempSync(path.join(os.tmpdir(), "kerf-ics-")), "feed.ics");
  writeFileSync(file, text);
  const { stdout } = await run("/usr/bin/python3", [path.resolve("tests/support/icalendar-read.py"), file]);
  return JSON.parse(stdout) as { uid: string; sequence: number; status: string; summary: string; start: string; end: string; tzid: string | null; stamp: string }[];
}

describe("each member's iCalendar feed", () => {
  it("is served as text/calendar, private, and read the same by ical.js and Python's icalendar", async () => {
    const { path: feedPath, url } = await newFeed(as.owner, "everything");
    expect(url).toMatch(/^http:\/\/kerf\.test\/api\/calendar-feeds\/[A-Za-z0-9_-]{43}\/kerf\.ics$/);
    const res = await fetchFeed(feedPath).expect(200);
    expect(res.headers["content-type"]).toBe("text/calendar; charset=utf-8");
    expect(res.headers["cache-control"]).toBe("private, max-age=300");
    const text = (res.body as Buffer).toString("utf8");
    expect(text.endsWith("END:VCALENDAR\r\n")).toBe(true);

    const events = icalEvents(text);
    const publish = events.find((e) => e.event.uid === `publish-${rotor.id}.${world.channel.id}@kerf`)!;
    expect(publish.event.startDate.isDate).toBe(true);
    expect(publish.event.startDate.toString()).toBe("2031-05-16");
    expect(publish.event.endDate.toString()).toBe("2031-05-17");
    expect(publish.component.getFirstPropertyValue("sequence")).toBe(0);
    expect(String(publish.component.getFirstProperty("dtstamp")!.toICALString())).toMatch(/^DTSTAMP:\d{8}T\d{6}Z$/);

    const python = await pythonEvents(text);
    expect(python.map((e) => e.uid).sort()).toEqual(events.map((e) => e.event.uid).sort());
    const py = python.find((e) => e.uid === publish.event.uid)!;
    expect(py).toMatchObject({ start: "2031-05-16", end: "2031-05-17", sequence: 0, status: "CONFIRMED" });
    expect(py.stamp).toMatch(/\+00:00$/);
    expect(events.find((e) => e.event.summary.endsWith("Invoice the sponsor"))?.event.description).toContain("Fee: 9876.00 EUR");
  });

  it("writes a timed release in the zone it was set in, with that zone's VTIMEZONE", async () => {
    await app.db.insert(publishPackages).values({ channelId: world.channel.id, episodeId: hinge.id, timeZone: "Europe/Berlin", publishAt: new Date("2031-05-16T15:30:00Z") });
    const { path: feedPath } = await newFeed(as.producer, "everything");
    const text = (await fetchFeed(feedPath).expect(200)).body.toString("utf8") as string;
    expect(text).toContain("DTSTART;TZID=Europe/Berlin:20310516T173000");
    expect(text).toContain("BEGIN:VTIMEZONE\r\nTZID:Europe/Berlin");
    const release = icalEvents(text).find((e) => e.event.uid.startsWith(`release-${hinge.id}`))!;
    expect(release.event.startDate.toJSDate().toISOString()).toBe("2031-05-16T15:30:00.000Z");
    const py = (await pythonEvents(text)).find((e) => e.uid === release.event.uid)!;
    expect(py).toMatchObject({ start: "2031-05-16T17:30:00+02:00", tzid: "Europe/Berlin" });
  });

  it("folds a long description into lines of at most 75 octets without splitting a character", async () => {
    const title = "Überprüfung — 9″ Rotor ✓ 弹性测试 ".repeat(4);
    await app.db.update(episodes).set({ title }).where(eq(episodes.id, hinge.id));
    const { path: feedPath } = await newFeed(as.editor, "everything");
    const raw: Buffer = (await fetchFeed(feedPath).expect(200)).body;
    const lines: Buffer[] = [];
    for (let start = 0, at = raw.indexOf("\r\n"); at !== -1; start = at + 2, at = raw.indexOf("\r\n", start)) lines.push(raw.subarray(start, at));
    const strict = new TextDecoder("utf-8", { fatal: true });
    for (const line of lines) {
      expect(line.length).toBeLessThanOrEqual(75);
      expect(() => strict.decode(line)).not.toThrow();
    }
    const summary = icalEvents(raw.toString("utf8")).find((e) => e.event.uid.startsWith(`publish-${hinge.id}`))!.event.summary;
    expect(summary).toBe(`Publish: ${title}`);
    await app.db.update(episodes).set({ title: "Hinge torture test" }).where(eq(episodes.id, hinge.id));
  });

  it("keeps UIDs, raises SEQUENCE on a change and sends an entry that left as cancelled", async () => {
    const { path: feedPath } = await newFeed(as.crew, "everything");
    const uid = `publish-${hinge.id}.${world.channel.id}@kerf`;
    const first = icalEvents((await fetchFeed(feedPath)).body.toString("utf8")).find((e) => e.event.uid === uid)!;
    expect(first.event.sequence).toBe(0);
    await app.db.update(episodes).set({ targetPublishDate: "2031-05-20" }).where(eq(episodes.id, hinge.id));
    const moved = icalEvents((await fetchFeed(feedPath)).body.toString("utf8")).find((e) => e.event.uid === uid)!;
    expect(moved.event.sequence).toBe(1);
    expect(moved.event.startDate.toString()).toBe("2031-05-20");
    await app.db.update(episodes).set({ archivedAt: new Date() }).where(eq(episodes.id, hinge.id));
    const text = (await fetchFeed(feedPath)).body.toString("utf8");
    const gone = icalEvents(text).find((e) => e.event.uid === uid)!;
    expect(gone.event.sequence).toBe(2);
    expect(gone.component.getFirstPropertyValue("status")).toBe("CANCELLED");
    expect((await pythonEvents(text)).find((e) => e.uid === uid)?.status).toBe("CANCELLED");
    await app.db.update(episodes).set({ archivedAt: null, targetPublishDate: "2031-05-16" }).where(eq(episodes.id, hinge.id));
  });

  it("holds only the member's own entries when they chose so", async () => {
    const { path: feedPath } = await newFeed(as.crew, "mine");
    const summaries = icalEvents((await fetchFeed(feedPath)).body.toString("utf8")).map((e) => e.event.summary);
    expect(summaries.length).toBe(2);
    expect(summaries.every((s) => s.startsWith("Shoot: "))).toBe(true);
  });

  it("has the same dates when the server runs under two different TZ settings", async () => {
    const { path: feedPath } = await newFeed(as.owner, "everything");
    const token = feedPath.split("/")[3]!;
    const datesUnder = async (tz: string) => {
      const { stdout } = await run(process.execPath, ["--import", "tsx", "tests/support/feed-under-zone.ts"], {
        env: { ...process.env, TZ: tz, DATABASE_URL: app.database.url, FEED_TOKEN: token, FEED_NOW: "2031-05-01T12:00:00Z" },
      });
      return stdout.split("\r\n").filter((line) => /^(UID|DTSTART|DTEND)/.test(line));
    };
    const [east, west] = [await datesUnder("Pacific/Kiritimati"), await datesUnder("Pacific/Pago_Pago")];
    expect(east.length).toBeGreaterThan(10);
    expect(west).toEqual(east);
  }, 120_000);

  it("answers 404 at a revoked or replaced address, and the account page lists the live one", async () => {
    const old = await newFeed(as.producer, "everything");
    const fresh = await newFeed(as.producer, "mine");
    await fetchFeed(old.path).expect(404);
    await fetchFeed(fresh.path).expect(200);
    const listed = (await as.producer.get("/api/account/calendar-feeds").expect(200)).body.feeds;
    expect(listed).toEqual([expect.objectContaining({ channelId: world.channel.id, channelName: "Calendar Channel", scope: "mine" })]);
    await as.producer.send("delete", `${c()}/calendar-feed`).expect(204);
    await fetchFeed(fresh.path).expect(404);
    await as.producer.send("delete", `${c()}/calendar-feed`).expect(404);
    await fetchFeed("/api/calendar-feeds/not-a-secret/kerf.ics").expect(404);
  });
});
