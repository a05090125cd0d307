import fc from "fast-check";
import { generateNKeysBetween } from "fractional-indexing";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { slatePlugs } from "../../server/app";
import { createBoardKeeper, type BoardAnswer } from "../../server/slate/board.service";
import type { BoardFilters } from "../../shared/slate/schemas";
import { stages } from "../../shared/slate/stages";
import { shiftDate } from "../../shared/sponsors/dates";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createDeal, createSponsor } from "../factories/sponsors";
import { startTestApp, type TestApp } from "../support/test-app";
import { board, cardOf, moveTo } from "./slate-support";

/*
 * A board kept by one process and brought up to date in place after each change must be the board
 * read whole: both keepers below read the same database, one keeping its board across the changes
 * (as a long-running process does), one new for every load.
 */
let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(() => app.close());

const today = new Date().toISOString().slice(0, 10);
const ranks = generateNKeysBetween(null, null, 12);
const tagChoices = [[], ["heat"], ["heat", "flying"], ["batteries"]];

type Change =
  | { kind: "move"; pick: number; stage: number; rank: number }
  | { kind: "edit"; pick: number; title: string; tags: number; owner: number; date: number | null }
  | { kind: "archive"; pick: number }
  | { kind: "restore"; pick: number }
  | { kind: "due"; pick: number; stage: number; days: number | null }
  | { kind: "add"; stage: number; rank: number }
  | { kind: "remove"; pick: number }
  | { kind: "sponsor"; pick: number }
  | { kind: "lengths"; days: number };

const pick = fc.nat(50);
const change: fc.Arbitrary<Change> = fc.oneof(
  { weight: 4, arbitrary: fc.record({ kind: fc.constant("move" as const), pick, stage: fc.nat(stages.length - 1), rank: fc.nat(ranks.length - 1) }) },
  {
    weight: 3,
    arbitrary: fc.record({ kind: fc.constant("edit" as const), pick, title: fc.string({ minLength: 1, maxLength: 12 }), tags: fc.nat(tagChoices.length - 1), owner: fc.nat(3), date: fc.option(fc.integer({ min: -40, max: 90 })) }),
  },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant("archive" as const), pick }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant("restore" as const), pick }) },
  { weight: 2, arbitrary: fc.record({ kind: fc.constant("due" as const), pick, stage: fc.nat(stages.length - 2), days: fc.option(fc.integer({ min: -30, max: 30 })) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant("add" as const), stage: fc.nat(stages.length - 1), rank: fc.nat(ranks.length - 1) }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant("remove" as const), pick }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant("sponsor" as const), pick }) },
  { weight: 1, arbitrary: fc.record({ kind: fc.constant("lengths" as const), days: fc.integer({ min: 1, max: 20 }) }) },
);

const filterChoices = (ownerId: string): BoardFilters[] => [{}, { archived: "1" }, { tag: "heat", risk: "1" }, { owner: ownerId }];
const bytesOf = (answer: BoardAnswer) => ("body" in answer ? answer.body.toString("base64") : Buffer.concat([answer.head, answer.tail]).toString());

describe("the board brought up to date in place", () => {
  it("when episodes, due dates, sponsor rows and stage lengths change in any order, then the kept board equals the board read whole", async () => {
    const { channel, owner, producer, editor } = await createCrewedChannel(app.db);
    const people = [null, owner.id, producer.id, editor.id];
    const pool = app.database.pool;
    for (let i = 0; i < 10; i++) {
      await createEpisode(app.db, channel.id, { title: `Episode ${i}`, stage: stages[i % stages.length], rank: ranks[i], ownerId: people[i % 4], tags: tagChoices[i % 4], targetPublishDate: i % 3 ? shiftDate(today, i * 7 - 20) : null });
    }
    const kept = createBoardKeeper();
    const compare = async () => {
      for (const filters of filterChoices(producer.id)) {
        const inPlace = await kept.load(app.db, slatePlugs, channel.id, { timeZone: "Europe/Berlin" }, filters);
        const whole = await createBoardKeeper().load(app.db, slatePlugs, channel.id, { timeZone: "Europe/Berlin" }, filters);
        expect(bytesOf(inPlace), JSON.stringify(filters)).toBe(bytesOf(whole));
        expect(inPlace.etag).toBe(whole.etag);
      }
    };
    await compare();

    const idAt = async (n: number) => {
      const { rows } = await pool.query<{ id: string }>("select id from episodes where channel_id = $1 order by created_at, id", [channel.id]);
      return rows.length ? rows[n % rows.length]!.id : null;
    };
    const apply = async (c: Change) => {
      const id = "pick" in c ? await idAt(c.pick) : null;
      if ("pick" in c && !id) return;
      switch (c.kind) {
        case "move":
          return pool.query("update episodes set stage = $2, rank = $3, stage_entered_at = now() - interval '3 days', version = version + 1 where id = $1", [id, stages[c.stage], ranks[c.rank]]);
        case "edit":
          return pool.query("update episodes set title = $2, tags = $3, owner_id = $4, target_publish_date = $5, version = version + 1 where id = $1", [
            id,
            c.title,
            tagChoices[c.tags],
            people[c.owner],
            c.date === null ? null : shiftDate(today, c.date),
          ]);
        case "archive":
          return pool.query("update episodes set archived_at = now() where id = $1", [id]);
        case "restore":
          return pool.query("update episodes set archived_at = null where id = $1", [id]);
        case "due":
          return c.days === null
            ? pool.query("delete from due_overrides where episode_id = $1", [id])
            : pool.query(
                "insert into due_overrides (channel_id, episode_id, stage, due_date) values ($1, $2, $3, $4) on conflict (episode_id, stage) do update set due_date = excluded.due_date",
                [channel.id, id, stages[c.stage], shiftDate(today, c.days)],
              );
        case "add":
          return createEpisode(app.db, channel.id, { title: "Added", stage: stages[c.stage], rank: ranks[c.rank], tags: ["heat"] });
        case "remove":
          return pool.query("delete from episodes where id = $1", [id]);
        case "sponsor": {
          const sponsor = await createSponsor(app.db, channel.id, { company: "Quillon Fasteners" });
          return createDeal(app.db, channel.id, id, { sponsorId: sponsor.id, publishDate: shiftDate(today, 3) });
        }
        case "lengths":
          return pool.query(
            "insert into slate_channels (channel_id, stage_lengths, board_revision) values ($1, $2, 1) on conflict (channel_id) do update set stage_lengths = excluded.stage_lengths, board_revision = slate_channels.board_revision + 1",
            [channel.id, JSON.stringify({ build: c.days })],
          );
      }
    };

    await fc.assert(
      fc.asyncProperty(fc.array(fc.array(change, { minLength: 1, maxLength: 3 }), { minLength: 1, maxLength: 5 }), async (batches) => {
        for (const batch of batches) {
          for (const c of batch) await apply(c);
          await compare();
        }
      }),
      { numRuns: 12 },
    );
    // The property held on the path it is about: most loads were brought up to date in place.
    expect(kept.made.inPlace).toBeGreaterThan(kept.made.whole);
  }, 180_000);

  it("when another process moves a card, then this one's kept board shows the move at once, read in place", async () => {
    const { channel, owner } = await createCrewedChannel(app.db);
    const [first, second] = [
      await createEpisode(app.db, channel.id, { title: "First", stage: "build", rank: ranks[0] }),
      await createEpisode(app.db, channel.id, { title: "Second", stage: "build", rank: ranks[1] }),
    ];
    const other = await startTestApp({ database: app.database });
    try {
      const here = await app.signedIn(owner);
      const there = await other.signedIn(owner);
      expect((await board(here, channel.id)).episodes.map((e) => e.title)).toEqual(["First", "Second"]);
      const moved = await moveTo(there, channel.id, { id: second.id, version: second.version }, { stage: "build", beforeId: first.id });
      expect(moved.status, JSON.stringify(moved.body)).toBe(200);
      const after = await board(here, channel.id);
      expect(after.episodes.map((e) => e.title)).toEqual(["Second", "First"]);
      expect(cardOf(after, second.id).version).toBe(moved.body.episode.version);
    } finally {
      await other.close();
    }
  });
});
