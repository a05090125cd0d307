import { randomUUID } from "node:crypto";
import pg from "pg";
import { connectDatabase, type DatabaseHandle } from "../../server/db/client";
import { testEnv } from "./test-env";

async function admin<T>(work: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: `${testEnv.clusterUrl}/postgres` });
  await client.connect();
  try {
    return await work(client);
  } finally {
    await client.end();
  }
}

export interface TestDatabase extends DatabaseHandle {
  name: string;
  url: string;
  drop(): Promise<void>;
}

/** A fresh copy of the migrated template: every test file gets rows no other file can see. */
export async function createTestDatabase(): Promise<TestDatabase> {
  const name = `kerf_t_${randomUUID().replaceAll("-", "").slice(0, 16)}`;
  await admin((client) => client.query(`create database "${name}" template "${testEnv.templateDatabase}"`));
  const url = `${testEnv.clusterUrl}/${name}`;
  const handle = connectDatabase(url);
  return {
    ...handle,
    name,
    url,
    async drop() {
      await handle.close();
      await admin((client) => client.query(`drop database if exists "${name}" with (force)`));
    },
  };
}
