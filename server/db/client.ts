import pg from "pg";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { prepareStatementsOn } from "./prepared-statements";
import { queriesInTurn } from "./queries-in-turn";

export type Database = NodePgDatabase;
/** What `db.transaction` hands its callback. */
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** The pool or a transaction: repository functions take either, so a service can put several writes in one transaction. */
export type Queryable = Database | Transaction;

export interface DatabaseHandle {
  pool: pg.Pool;
  db: Database;
  close(): Promise<void>;
}

export function connectDatabase(url: string): DatabaseHandle {
  const pool = new pg.Pool({ connectionString: url, max: 10, connectionTimeoutMillis: 5_000 });
  // An idle client that loses its server (a restart) must not crash the process.
  pool.on("error", (error) => console.error(`[db] idle client error: ${error.message}`));
  pool.on("connect", (client) => {
    prepareStatementsOn(client);
    queriesInTurn(client);
  });
  return { pool, db: drizzle(pool), close: () => pool.end() };
}
