import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { seedDemo } from "../../dev-services/demo/channel";
import { buildLog } from "../../server/bench/build-log.service";
import { episodeRuns } from "../../server/bench/runs.service";
import { testPlanView } from "../../server/bench/test-plan.service";
import { bestRun } from "../../shared/bench/comparison";
import { isOverRated } from "../../shared/bench/runs";
import { createTestDatabase, type TestDatabase } from "../support/database";

let database: TestDatabase;
let where: { channelId: string; episodeId: string };
beforeAll(async () => {
  database = await createTestDatabase();
  await seedDemo(database.db, new Date("2026-12-02T08:00:00Z"));
  const [row] = (await database.pool.query("select channel_id, id from episodes where title = 'Case fans versus one big rotor'")).rows;
  where = { channelId: row.channel_id, episodeId: row.id };
});
afterAll(() => database.drop());

describe("the bench demo", () => {
  it("when the demo is seeded, then the test-plan episode has a full sheet with required criteria and checked hazards", async () => {
    const plan = await testPlanView(database.db, where.channelId, where.episodeId);
    expect(plan.hypothesis).not.toBe("");
    expect(plan.quantities.length).toBeGreaterThanOrEqual(4);
    expect(plan.criteria.filter((c) => c.required)).toHaveLength(2);
    expect(plan.hazards.length).toBeGreaterThanOrEqual(5);
    expect(plan.hazards.some((h) => h.checkedBy)).toBe(true);
  });

  it("has five candidate parts with runs: two miss the plan, one meets it, and one run is over-rated", async () => {
    const runs = await episodeRuns(database.db, where.channelId, where.episodeId);
    const candidates = new Set(runs.flatMap((run) => run.parts.filter((part) => part.kind !== "propeller").map((part) => part.partId)));
    expect(candidates.size).toBe(5);
    const verdicts = runs.map((run) => run.evaluation.verdict);
    expect(verdicts.filter((v) => v === "fail")).toHaveLength(2);
    expect(verdicts.filter((v) => v === "pass")).toHaveLength(1);
    expect(runs.filter((run) => isOverRated(run.evaluation)).map((run) => run.label)).toEqual(["Fjell with the 10-inch prop on 4S"]);
    expect(bestRun(runs)?.label).toBe("Tarn with the 10-inch prop on 3S");
  });

  it("has three build iterations, each with thrust-to-weight from the chosen run", async () => {
    const log = await buildLog(database.db, where.channelId, where.episodeId);
    expect(log.map((i) => i.number)).toEqual([1, 2, 3]);
    expect(log.map((i) => i.chosenRun?.label)).toEqual(Array(3).fill("Tarn with the 10-inch prop on 3S"));
    // 760 gf from that run over each all-up mass: 640 g, 20.6 oz and 655 g. 1 oz = 28.349523125 g
    // (NIST SP 811 (2008), Appendix B.8), so 20.6 oz = 584.0002 g; own arithmetic for the ratios.
    expect(log.map((i) => i.thrustToWeight)).toEqual([
      { value: expect.closeTo(760 / 640, 9), unit: "1" },
      { value: expect.closeTo(760 / (20.6 * 28.349523125), 9), unit: "1" },
      { value: expect.closeTo(760 / 655, 9), unit: "1" },
    ]);
  });
});
