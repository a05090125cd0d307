import { drizzle } from "drizzle-orm/node-postgres";
import type pg from "pg";
import { sql, type SQL } from "drizzle-orm";
import type { Database, Queryable } from "./client";

/** Runs raw SQL on the transaction's own connection (the shape pg-boss's `db` option takes). */
export interface SqlExecutor {
  executeSql(text: string, values?: unknown[]): Promise<{ rows: unknown[] }>;
}

/**
 * One transaction on one connection, offered both as Drizzle and as raw SQL, so rows and the jobs
 * they queue (pg-boss `send` with `db`) commit together or not at all.
 */
export async function inTransaction<T>(db: Database, work: (tx: Database, sql: SqlExecutor) => Promise<T>): Promise<T> {
  // drizzle(pool) keeps its pool as $client; a transaction needs one connection of it to itself.
  const pool = (db as Database & { $client: pg.Pool }).$client;
  const client = await pool.connect();
  let broken: Error | undefined;
  try {
    await client.query("begin");
    const result = await work(drizzle(client), { executeSql: (text, values) => client.query(text, values) });
    await client.query("commit");
    return result;
  } catch (error) {
    // A connection that cannot even roll back is dropped rather than handed to the next caller.
    await client.query("rollback").catch((rollbackError: Error) => (broken = rollbackError));
    throw error;
  } finally {
    client.release(broken);
  }
}

/**
 * Raw SQL with $1…$n parameters on a Drizzle transaction a seam was handed (a go-live follower),
 * so the jobs a follower queues commit with the transaction it runs in.
 */
export function sqlExecutorOf(tx: Queryable): SqlExecutor {
  return {
    async executeSql(text, values = []) {
      const parts = text.split(/\$(\d+)/);
      const chunks: SQL[] = [];
      parts.forEach((part, index) => chunks.push(index % 2 === 0 ? sql.raw(part) : sql`${sql.param(values[Number(part) - 1] ?? null)}`));
      const result = await tx.execute(sql.join(chunks));
      return { rows: result.rows };
    },
  };
}
