import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { makeQueue } from "../../server/jobs/make-queue";
import { createTestDatabase, type TestDatabase } from "../support/database";

/*
 * Every server process makes the job queues it works on when it starts. Several processes (or
 * machines) starting at once on a new database make the same queues at the same moment.
 */
let database: TestDatabase;
let bosses: PgBoss[] = [];
beforeAll(async () => {
  database = await createTestDatabase();
  bosses = Array.from({ length: 4 }, () => new PgBoss({ connectionString: database.url, schema: "pgboss", max: 2, supervise: false, schedule: false }));
  // As the server does (server/jobs/queue.ts): pg-boss raises a connection's error as an "error" event,
  // which with no listener is an uncaught exception. Dropping the database at the end ends any
  // connection still closing with "terminating connection due to administrator command".
  for (const boss of bosses) boss.on("error", () => undefined);
  await Promise.all(bosses.map((boss) => boss.start()));
});
afterAll(async () => {
  await Promise.all(bosses.map((boss) => boss.stop({ graceful: false, wait: true })));
  await database.drop();
});

describe("making job queues", () => {
  it("when four processes make the same eight new queues at once, then none fails and each queue is made once", async () => {
    const names = Array.from({ length: 8 }, (_, n) => `made-together-${n}`);
    await Promise.all(bosses.map((boss) => Promise.all(names.map((name) => makeQueue(boss, name)))));
    const { rows } = await database.pool.query(`select name from pgboss.queue where name like 'made-together-%' order by name`);
    expect(rows.map((row) => row.name)).toEqual(names);
    for (const name of names) expect(await bosses[0]!.getQueue(name)).toMatchObject({ name });
  }, 120_000);

  it("when a queue already exists, then making it again changes nothing", async () => {
    await makeQueue(bosses[0]!, "made-twice");
    const before = await bosses[0]!.getQueue("made-twice");
    await makeQueue(bosses[1]!, "made-twice");
    expect(await bosses[1]!.getQueue("made-twice")).toEqual(before);
  });
});
