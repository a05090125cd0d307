import { readFileSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createCrewedChannel } from "../factories/accounts";
import { createEpisode } from "../factories/episodes";
import { createDeal, createSponsor, createTemplate } from "../factories/sponsors";
import { createTestDatabase, type TestDatabase } from "../support/database";

// The migration that paired approval items also paired what existed before it. Its backfill
// statements are run again here on rows made as they were before (no pairing), and must pair them.
const migration = readFileSync(path.resolve(import.meta.dirname, "../../drizzle/0009_sponsors_approval_pairs.sql"), "utf8");
const backfill = migration.split("--> statement-breakpoint").filter((statement) => /^\s*(--.*\n\s*)*UPDATE/m.test(statement));

let database: TestDatabase;
beforeAll(async () => {
  database = await createTestDatabase();
});
afterAll(async () => {
  await database.close();
});

describe("pairing what was made before items could be paired", () => {
  it("pairs each deal's script approval with its one script draft, final approval with its one draft cut, and templates the same way", async () => {
    const world = await createCrewedChannel(database.db, "Backfill Bench");
    const episode = await createEpisode(database.db, world.channel.id, { targetPublishDate: "2027-09-30" });
    const sponsor = await createSponsor(database.db, world.channel.id);
    const made = await createDeal(database.db, world.channel.id, episode.id, { sponsorId: sponsor.id, publishDate: "2027-09-30" });
    // A deal with two script drafts: which one the approval approves is not for a migration to guess.
    const twoDrafts = await createDeal(database.db, world.channel.id, episode.id, {
      sponsorId: sponsor.id,
      publishDate: "2027-09-30",
      items: [
        { kind: "script_draft", title: "First draft", anchor: "before_publish", offsetDays: 21, ownerRole: null },
        { kind: "script_draft", title: "Second draft", anchor: "before_publish", offsetDays: 18, ownerRole: null },
        { kind: "script_approval", title: "Approval", anchor: "before_publish", offsetDays: 14, ownerRole: null },
      ],
    });
    const template = await createTemplate(database.db, world.channel.id, [
      { kind: "script_draft", title: "Draft", anchor: "before_publish", offsetDays: 21, ownerRole: null },
      { kind: "draft_cut", title: "Cut", anchor: "before_publish", offsetDays: 7, ownerRole: null },
      { kind: "final_approval", title: "Final", anchor: "before_publish", offsetDays: 3, ownerRole: null },
      { kind: "script_approval", title: "Script okay", anchor: "before_publish", offsetDays: 14, ownerRole: null },
    ]);
    await database.pool.query("update deliverables set approves_id = null");

    expect(backfill).toHaveLength(2);
    for (const statement of backfill) await database.pool.query(statement);

    const pairs = await database.pool.query<{ deal_id: string; kind: string; approves: string }>(
      "select d.deal_id, d.kind::text, p.kind::text as approves from deliverables d join deliverables p on p.id = d.approves_id order by d.position",
    );
    expect(pairs.rows).toEqual([
      { deal_id: made.deal.id, kind: "script_approval", approves: "script_draft" },
      { deal_id: made.deal.id, kind: "final_approval", approves: "draft_cut" },
    ]);
    expect(twoDrafts.items.every((item) => pairs.rows.every((row) => row.deal_id !== item.dealId))).toBe(true);
    const items = (await database.pool.query("select items from deal_templates where id = $1", [template.id])).rows[0].items;
    expect(items.map((item: { approves?: number | null }) => item.approves)).toEqual([undefined, undefined, 1, 0]);
  });
});
