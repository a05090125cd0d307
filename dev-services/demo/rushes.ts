import type { ShotKind } from "../../shared/rushes/vocabulary";
import { formatTimecode, parseTimecode } from "../../shared/timecode/timecode";
import { clipMarks, shootDayCrew } from "../../server/db/schema/rushes";
import { createClip, createShootDay, createShot } from "../../tests/factories/rushes";
import { localDate } from "../../shared/slate/dates";
import { DEMO_TIME_ZONE, type DemoContext } from "./context";

/**
 * The demo channel's shoot days, shot lists and clips (invented, like everything in the demo). The
 * clips are placeholders with metadata only: no file sits in storage behind them, so their preview
 * says so; uploading real files from an episode's page works as usual.
 */
interface DemoShot {
  description: string;
  kind: ShotKind;
  priority?: "must" | "normal" | "spare";
  clips?: { camera: string; seconds: number; rating?: "select" | "maybe" | "reject"; tags?: string[]; notes?: string; marks?: [number, number, string][] }[];
}

const plans: Record<string, { place: string; callTime: string; daysAgo: number; shots: DemoShot[] }> = {
  "Thermal camera on a kite": {
    // Today: nothing is captured yet, so the crew's home lists every shot.
    place: "Hilltop allotments",
    callTime: "06:45",
    daysAgo: 0,
    shots: [
      { description: "Host explains why heat leaks show at dawn", kind: "talking_head", priority: "must" },
      { description: "Camera cradle close-up: the two rubber dampers", kind: "build_closeup" },
      { description: "Kite climbs with the camera swinging", kind: "aerial", priority: "must" },
      { description: "Thermal view of the roof, steady for five seconds", kind: "test_run", priority: "must" },
      { description: "Tying the bridle knot", kind: "insert", priority: "spare" },
    ],
  },
  "Two-stage bottle rocket": {
    place: "Sports field by the river",
    callTime: "09:00",
    daysAgo: 2,
    shots: [
      {
        description: "Launch of the single big bottle",
        kind: "test_run",
        priority: "must",
        clips: [
          { camera: "A cam", seconds: 24, rating: "select", tags: ["launch"], marks: [[6, 11, "lift-off to apogee"]] },
          { camera: "Phone", seconds: 30, rating: "reject", tags: ["launch"], notes: "out of focus" },
        ],
      },
      {
        description: "Stage separation in slow motion",
        kind: "slow_motion",
        priority: "must",
        clips: [{ camera: "High-speed", seconds: 12, rating: "select", tags: ["separation", "failure"], notes: "the coupler jams on the first try", marks: [[3, 5, "the moment the coupler jams"]] }],
      },
      { description: "Host counts down", kind: "talking_head", clips: [{ camera: "A cam", seconds: 65, rating: "maybe", tags: ["intro"] }] },
      { description: "Measuring the landing distance with the wheel", kind: "insert", priority: "normal" },
      { description: "Drone follow of the second flight", kind: "aerial", priority: "spare" },
    ],
  },
  "Relay calculator": {
    place: "Workshop bench",
    callTime: "10:00",
    daysAgo: 12,
    shots: [
      { description: "Wide of all 120 relays clicking", kind: "build_closeup", clips: [{ camera: "A cam", seconds: 95, rating: "select", tags: ["wiring", "wide"], marks: [[12, 30, "carry ripples across the board"]] }] },
      { description: "Close-up of the wiring loom", kind: "build_closeup", clips: [{ camera: "B cam", seconds: 52, rating: "select", tags: ["wiring", "close-up"] }, { camera: "B cam", seconds: 38, tags: ["wiring"] }] },
      { description: "A relay welds shut and the sum goes wrong", kind: "test_run", priority: "must", clips: [{ camera: "A cam", seconds: 70, rating: "select", tags: ["failure"], notes: "the part fails at 42 s", marks: [[40, 46, "relay 9 welds shut"]] }] },
      { description: "Host explains binary carry", kind: "talking_head", clips: [{ camera: "A cam", seconds: 180, rating: "maybe", tags: ["explainer"] }] },
      { description: "Pickup: hand flips the input switches", kind: "pickup", priority: "normal" },
    ],
  },
};

export async function seedRushesDemo(context: DemoContext): Promise<void> {
  const { db, channelId, episodes, people, today } = context;
  const crew = [people.get("crew")!, people.get("editor")!];
  const format = { rate: { numerator: 30000, denominator: 1001 }, dropFrame: true };
  let take = 1;
  for (const episode of episodes) {
    const plan = plans[episode.title];
    if (!plan) continue;
    const day = new Date(today.getTime() - plan.daysAgo * 86_400_000);
    // The day as the demo's people (all in Oslo) count it, so "today" is today on their homes.
    const shootDay = await createShootDay(db, channelId, episode.id, { day: localDate(day, DEMO_TIME_ZONE), place: plan.place, callTime: plan.callTime });
    await db.insert(shootDayCrew).values(crew.map((p) => ({ shootDayId: shootDay.id, userId: p.id })));
    for (const [index, s] of plan.shots.entries()) {
      const hasClips = (s.clips?.length ?? 0) > 0;
      const shot = await createShot(db, channelId, episode.id, {
        description: s.description,
        kind: s.kind,
        priority: s.priority ?? "normal",
        shootDayId: shootDay.id,
        position: index,
        status: hasClips ? "captured" : "planned",
      });
      for (const c of s.clips ?? []) {
        // Each take starts where the camera's free-running timecode had got to.
        const start = parseTimecode("09:00:00;00", format) + take * 30 * 120;
        const marks = c.marks ?? [];
        const clip = await createClip(db, channelId, episode.id, {
          fileName: `${c.camera.replace(/\W+/g, "").toUpperCase().slice(0, 4)}_C${String(take).padStart(3, "0")}.MOV`,
          sizeBytes: Math.round(c.seconds * 12_500_000),
          durationMs: Math.round(c.seconds * 1000),
          startTimecode: formatTimecode(start, format),
          camera: c.camera,
          recordedAt: new Date(day.getTime() + (9 * 60 + take * 7) * 60_000),
          shotId: shot.id,
          shootDayId: shootDay.id,
          kind: s.kind,
          rating: c.rating ?? null,
          tags: c.tags ?? [],
          notes: c.notes ?? "",
          markCount: marks.length,
        });
        for (const [from, to, note] of marks) {
          const inFrame = start + Math.round(from * 29.97);
          const outFrame = start + Math.round(to * 29.97);
          await db.insert(clipMarks).values({ channelId, clipId: clip.id, inFrame, outFrame, inLabel: formatTimecode(inFrame, format), outLabel: formatTimecode(outFrame, format), note });
        }
        take++;
      }
    }
  }
}
