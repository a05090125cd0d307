import { rmSync } from "node:fs";
import path from "node:path";
import { connectDatabase } from "../../server/db/client";
import { migrateDatabase } from "../../server/db/migrate";
import { stateDir } from "../../dev-services/paths";
import { ensureDatabase, startCluster, type Cluster } from "../../dev-services/postgres";
import { freePort } from "../../dev-services/processes";
import type { TestDatabase } from "./database";

/**
 * A PostgreSQL cluster of one test file's own, for tests that stop and restart the server: the
 * shared test cluster must keep running for everyone else.
 */
export interface PrivateCluster {
  database: TestDatabase;
  stop(): void;
  start(): void;
  remove(): Promise<void>;
}

export async function startPrivateCluster(): Promise<PrivateCluster> {
  const port = await freePort();
  const dataDir = path.join(stateDir, `pg-fault-${process.pid}-${port}`);
  let cluster: Cluster = startCluster({ dataDir, port, fresh: true });
  const url = await ensureDatabase(cluster, "kerf_fault");
  await migrateDatabase(url);
  const handle = connectDatabase(url);
  const database: TestDatabase = { ...handle, name: "kerf_fault", url, drop: () => handle.close() };
  return {
    database,
    stop: () => cluster.stop(),
    start: () => {
      cluster = startCluster({ dataDir, port });
    },
    async remove() {
      await handle.close().catch(() => undefined);
      cluster.stop();
      rmSync(cluster.dataDir, { recursive: true, force: true });
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}
