import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { queriesInTurn } from "../../server/db/queries-in-turn";
import { createTestDatabase, type TestDatabase } from "../support/database";

/*
 * The app's connections send one query at a time (server/db/queries-in-turn.ts, set on each connection
 * by server/db/client.ts): reads started side by side on a transaction wait their turn instead of
 * leaning on pg's own queue, which pg deprecates. Each test watches what reaches pg's client beneath.
 */
let database: TestDatabase;

beforeAll(async () => {
  database = await createTestDatabase();
});
afterAll(async () => {
  await database.drop();
});

/** pg's client in its own words: a query running, or queries queued behind it. */
type PgClientInside = { _activeQuery: unknown; _queryQueue: unknown[] };

/** A connection whose queries take turns, and, for each query that reached pg, whether pg was busy. */
async function withWatchedConnection(work: (client: pg.Client, busyAtEach: boolean[]) => Promise<void>) {
  const client = new pg.Client({ connectionString: database.url });
  await client.connect();
  const busyAtEach: boolean[] = [];
  const toPg = client.query.bind(client) as (...args: unknown[]) => unknown;
  const inside = client as unknown as PgClientInside;
  client.query = ((...args: unknown[]) => {
    busyAtEach.push(Boolean(inside._activeQuery) || inside._queryQueue.length > 0);
    return toPg(...args);
  }) as typeof client.query;
  queriesInTurn(client);
  try {
    await work(client, busyAtEach);
  } finally {
    await client.end();
  }
}

describe("one query at a time on a connection", () => {
  it("when three queries are started side by side, then each reaches pg once the one before has answered, in the order asked", async () => {
    await withWatchedConnection(async (client, busyAtEach) => {
      const answers = await Promise.all([1, 2, 3].map((n) => client.query<{ n: number }>("select pg_sleep(0.02), $1::int as n", [n])));
      expect(answers.map((answer) => answer.rows[0]!.n)).toEqual([1, 2, 3]);
      expect(busyAtEach).toEqual([false, false, false]);
    });
  });

  it("when one of them fails, then the next still runs, and the failure is its own", async () => {
    await withWatchedConnection(async (client, busyAtEach) => {
      const settled = await Promise.allSettled([client.query("select 1 as n"), client.query("select * from no_such_table"), client.query("select 3 as n")]);
      expect(settled.map((result) => result.status)).toEqual(["fulfilled", "rejected", "fulfilled"]);
      expect((settled[1] as PromiseRejectedResult).reason.message).toMatch(/no_such_table/);
      expect(busyAtEach).toEqual([false, false, false]);
    });
  });

  it("when the app reads side by side in a transaction, then every read answers", async () => {
    const answers = await database.db.transaction(async (tx) =>
      Promise.all([1, 2, 3, 4].map(async (n) => (await tx.execute<{ n: number }>(`select ${n}::int as n`)).rows[0]!.n)),
    );
    expect(answers).toEqual([1, 2, 3, 4]);
  });
});
