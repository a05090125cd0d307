import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { sql } from "drizzle-orm";
import { prepareStatementsOn, statementName } from "../../server/db/prepared-statements";
import { createTestDatabase, type TestDatabase } from "../support/database";

/*
 * Statements the app sends with parameters are prepared once per connection (server/db/client.ts);
 * PostgreSQL lists a connection's prepared statements in pg_prepared_statements.
 */
let database: TestDatabase;

beforeAll(async () => {
  database = await createTestDatabase();
});
afterAll(async () => {
  await database.drop();
});

async function preparedOn(client: pg.ClientBase) {
  return (await client.query<{ name: string; statement: string }>("select name, statement from pg_prepared_statements")).rows;
}

/** A connection of its own from the app's pool, closed after, so no test sees another's statements. */
async function withNewConnection(work: (client: pg.PoolClient) => Promise<void>) {
  const client = await database.pool.connect();
  try {
    await work(client);
  } finally {
    client.release(true);
  }
}

describe("prepared statements on every connection", () => {
  it("when the same statement is sent twice on one connection, then it is prepared once under its text's name and both answer", async () => {
    await withNewConnection(async (client) => {
      const first = await client.query("select $1::int + 1 as n", [1]);
      const second = await client.query({ text: "select $1::int + 1 as n", values: [41] });
      expect([first.rows[0].n, second.rows[0].n]).toEqual([2, 42]);
      expect(await preparedOn(client)).toEqual([{ name: statementName("select $1::int + 1 as n"), statement: "select $1::int + 1 as n" }]);
    });
  });

  it("when drizzle runs a query in a transaction, then its statement is prepared on that connection and its rows are drizzle's", async () => {
    const rows = await database.db.transaction(async (tx) => {
      const answer = await tx.execute(sql`select ${"seven"}::text as word`);
      const prepared = await tx.execute(sql`select statement from pg_prepared_statements`);
      return { answer: answer.rows, prepared: prepared.rows.map((row) => row.statement) };
    });
    expect(rows.answer).toEqual([{ word: "seven" }]);
    expect(rows.prepared).toContain("select $1::text as word");
  });

  it("when a statement has no parameters or already has a name, then it is sent as it is", async () => {
    await withNewConnection(async (client) => {
      await client.query("select 1");
      await client.query({ name: "chosen", text: "select $1::int as n", values: [3] });
      const prepared = await preparedOn(client);
      expect(prepared.filter((row) => row.statement === "select $1::int as n").map((row) => row.name)).toEqual(["chosen"]);
      expect(prepared.filter((row) => row.statement === "select 1")).toEqual([]);
    });
  });

  it("when a connection has prepared its limit, then a new statement is sent unnamed and the prepared ones are still used", async () => {
    const client = new pg.Client({ connectionString: database.url });
    await client.connect();
    try {
      prepareStatementsOn(client, 2);
      for (const n of [1, 2, 3]) await client.query(`select $1::int * ${n} as n`, [n]);
      expect((await client.query("select $1::int * 3 as n", [5])).rows[0].n).toBe(15);
      expect(await preparedOn(client)).toHaveLength(2);
      expect((await client.query("select $1::int * 1 as n", [9])).rows[0].n).toBe(9);
      expect(await preparedOn(client)).toHaveLength(2);
    } finally {
      await client.end();
    }
  });
});
