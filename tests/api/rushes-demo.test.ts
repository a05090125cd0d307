import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemo } from "../../dev-services/demo/channel";
import { parseTimecode } from "../../shared/timecode/timecode";
import { createTestDatabase, type TestDatabase } from "../support/database";

let database: TestDatabase;
beforeAll(async () => {
  database = await createTestDatabase();
  await seedDemo(database.db, new Date("2026-12-02T08:00:00Z"));
});
afterAll(() => database.drop());

const rows = async (sql: string) => (await database.pool.query(sql)).rows;

describe("the rushes demo", () => {
  it("when the demo is seeded, then shoot-stage episodes have days, shot lists and logged placeholder clips", async () => {
    const [counts] = await rows(`select (select count(*)::int from shoot_days) as days, (select count(*)::int from shots) as shots,
      (select count(*)::int from clips) as clips, (select count(*)::int from clip_marks) as marks`);
    expect(counts).toEqual({ days: 3, shots: 15, clips: 9, marks: 4 });
  });

  it("keeps the shot list honest: a shot is captured exactly when a clip is linked to it", async () => {
    const mismatched = await rows(`select description from shots s where (s.status = 'captured') <> exists (select 1 from clips c where c.shot_id = s.id)`);
    expect(mismatched).toEqual([]);
  });

  it("gives every mark labels that match its frames and lie inside its clip", async () => {
    const marks = await rows(`select m.in_frame, m.out_frame, m.in_label, m.out_label, c.start_timecode, c.duration_ms, c.mark_count
      from clip_marks m join clips c on c.id = m.clip_id`);
    const df = { rate: { numerator: 30000, denominator: 1001 }, dropFrame: true };
    for (const m of marks) {
      expect(parseTimecode(m.in_label, df)).toBe(m.in_frame);
      expect(parseTimecode(m.out_label, df)).toBe(m.out_frame);
      const start = parseTimecode(m.start_timecode, df);
      expect(m.in_frame).toBeGreaterThanOrEqual(start);
      expect(m.out_frame).toBeLessThanOrEqual(start + Math.round((m.duration_ms / 1000) * 29.97));
      expect(m.mark_count).toBeGreaterThan(0);
    }
  });
});
