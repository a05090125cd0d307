import { addDays, formatISO, subDays, subHours } from "date-fns";
import { eq } from "drizzle-orm";
import type { Role } from "../../shared/access/roles";
import { lastWorkingDayOnOrBefore } from "../../shared/slate/dates";
import { mentionedIn } from "../../shared/slate/mentions";
import { defaultStageLengths } from "../../shared/slate/schedule";
import { stageIndex, stages, type Stage } from "../../shared/slate/stages";
import { dueOverrides, episodeComments, episodes, slateChannels, stageMoves } from "../../server/db/schema/slate";
import type { DemoContext } from "./context";

/**
 * The demo channel's slate (invented, like everything in the demo): every episode gets a history
 * that walks it to its stage, and a few are shaped so the board shows each of the slate's flags:
 * - overdue: "Mousetrap car distance record", whose build date was set by hand to last week;
 * - plan starts in the past: "Paper glider from a desk fan", given a publish date ten days out;
 * - moved on without essentials: "Drill-motor skateboard", moved to build with a reason;
 * - no publish date: "Solar-only espresso", its date not fixed yet;
 * - one episode went back a stage and on again ("Two-stage bottle rocket").
 */
const day = (date: Date) => formatISO(date, { representation: "date" });

// Who usually moves an episode out of each stage (invented habits of the demo team).
const movers: Record<Stage, Role> = {
  challenge: "owner",
  test_plan: "owner",
  build: "owner",
  shoot: "producer",
  edit: "editor",
  sponsor_read: "producer",
  publish: "editor",
};

export async function seedSlateDemo(context: DemoContext): Promise<void> {
  const { db, today, channelId, people } = context;
  const person = (role: Role) => people.get(role)!;
  const byTitle = (title: string) => context.episodes.find((e) => e.title === title);

  // The channel builds and edits a little faster than Kerf's starting lengths.
  await db
    .insert(slateChannels)
    .values({ channelId, stageLengths: { ...defaultStageLengths, build: 8, edit: 6 } })
    .onConflictDoUpdate({ target: slateChannels.channelId, set: { stageLengths: { ...defaultStageLengths, build: 8, edit: 6 } } });

  // Dates first, so the later features (sponsor deliverables) count from the final ones.
  const glider = byTitle("Paper glider from a desk fan");
  if (glider) await setTarget(context, glider, day(addDays(today, 10)));
  const espresso = byTitle("Solar-only espresso");
  if (espresso) await setTarget(context, espresso, null);

  for (const [order, episode] of context.episodes.entries()) {
    const reached = stageIndex(episode.stage);
    // Older episodes are further along: about five days per stage, a little apart from each other.
    const created = subHours(subDays(today, 4 + reached * 5 + (order % 3)), 3 + (order % 5));
    const path: { from: Stage | null; to: Stage; at: Date; by: Role; reason?: string; skipped?: { code: string; message: string }[] }[] = [
      { from: null, to: "challenge", at: created, by: "owner" },
    ];
    for (let i = 1; i <= reached; i++) {
      path.push({ from: stages[i - 1]!, to: stages[i]!, at: subHours(subDays(today, 4 + (reached - i) * 5 + (order % 3)), 2 + i), by: movers[stages[i - 1]!] });
    }
    if (episode.title === "Drill-motor skateboard") {
      const last = path[path.length - 1]!;
      last.reason = "The motors arrived early; we write up the pass criteria while the frame is glued.";
      last.skipped = [{ code: "test_plan.no_required_criterion", message: "The test plan has no required pass criterion yet." }];
    }
    if (episode.title === "Two-stage bottle rocket") {
      // Shot once, the coupler failed on camera: back to build for a day, then shot again.
      const shoot = path[path.length - 1]!;
      path.push({ from: "shoot", to: "build", at: addDays(shoot.at, 1), by: "producer", reason: "The stage coupler cracked on the first launch; rebuilding it." });
      path.push({ from: "build", to: "shoot", at: addDays(shoot.at, 2), by: "owner" });
    }
    await db.insert(stageMoves).values(
      path.map((move) => ({
        channelId,
        episodeId: episode.id,
        fromStage: move.from,
        toStage: move.to,
        movedBy: person(move.by).id,
        movedAt: move.at,
        reason: move.reason ?? null,
        skipped: move.skipped ?? [],
      })),
    );
    await db
      .update(episodes)
      .set({ createdAt: created, updatedAt: path[path.length - 1]!.at, stageEnteredAt: path[path.length - 1]!.at })
      .where(eq(episodes.id, episode.id));
  }

  // Build was given a hard stop by hand last week (the workshop was booked for another job); it slipped.
  const mousetrap = byTitle("Mousetrap car distance record");
  if (mousetrap) {
    await db.insert(dueOverrides).values({ channelId, episodeId: mousetrap.id, stage: "build", dueDate: lastWorkingDayOnOrBefore(day(subDays(today, 4))), setBy: person("owner").id, setAt: subDays(today, 9) });
    await db.update(episodes).set({ version: 2 }).where(eq(episodes.id, mousetrap.id));
  }

  await seedComments(context);
}

async function setTarget(context: DemoContext, episode: DemoContext["episodes"][number], date: string | null) {
  await context.db.update(episodes).set({ targetPublishDate: date }).where(eq(episodes.id, episode.id));
  episode.targetPublishDate = date;
}

const demoComments: { title: string; by: Role; hoursAgo: number; body: string }[] = [
  { title: "Leaf-blower hovercraft", by: "producer", hoursAgo: 50, body: "@Noor Halvorsen a tool brand asked about this one; shall I pitch it as their segment?" },
  { title: "Leaf-blower hovercraft", by: "owner", hoursAgo: 46, body: "Yes, but only if we can say the blowers are theirs. @Kwame Lindqvist we need a skirt test rig first." },
  { title: "Drill-motor skateboard", by: "crew", hoursAgo: 30, body: "Frame is glued. @Ilse Marchetti I filmed the glue-up in slow motion if you want it for the intro." },
  { title: "Mousetrap car distance record", by: "owner", hoursAgo: 20, body: "@Ilse Marchetti build is late: the axle bushings are still in the post. Can edit start on the intro meanwhile?" },
  { title: "Relay calculator", by: "editor", hoursAgo: 8, body: "Rough cut is up. @Teodor Baptiste the sponsor segment sits at 7:40; it runs 62 s against the 60 s in the deal." },
  { title: "Two-stage bottle rocket", by: "crew", hoursAgo: 26, body: "Second launch: the new coupler held. Both angles captured." },
];

async function seedComments({ db, today, channelId, people, episodes: list }: DemoContext) {
  const mentionable = [...people.values()].map((p) => ({ id: p.id, name: p.name }));
  for (const comment of demoComments) {
    const episode = list.find((e) => e.title === comment.title);
    if (!episode) continue;
    await db.insert(episodeComments).values({
      channelId,
      episodeId: episode.id,
      authorId: people.get(comment.by)!.id,
      body: comment.body,
      mentions: mentionedIn(comment.body, mentionable),
      createdAt: subHours(today, comment.hoursAgo),
    });
  }
}
