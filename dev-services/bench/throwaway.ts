import { rmSync } from "node:fs";
import path from "node:path";
import { migrateDatabase } from "../../server/db/migrate";
import { repoRoot } from "../paths";
import { ensureDatabase, startCluster } from "../postgres";
import { freePort, run } from "../processes";

type Stops = (() => Promise<void> | void)[];

/** A PostgreSQL cluster of the benchmark's own in `work`, one migrated database in it; stopped and removed by `stops`. */
export async function throwawayDatabase(work: string, name: string, stops: Stops): Promise<string> {
  rmSync(work, { recursive: true, force: true });
  const cluster = startCluster({ dataDir: path.join(work, "pg"), port: await freePort(), fresh: true });
  stops.push(() => {
    cluster.stop();
    rmSync(work, { recursive: true, force: true });
  });
  const databaseUrl = await ensureDatabase(cluster, name);
  await migrateDatabase(databaseUrl);
  return databaseUrl;
}

/**
 * The client built into `dir`, removed by `stops`: a folder outside .kerf/ (the server serves no path
 * under a dot-folder) and away from dist/, which other runs use.
 */
export async function builtClient(dir: string, stops: Stops): Promise<void> {
  stops.push(() => rmSync(dir, { recursive: true, force: true }));
  const built = await run(path.join(repoRoot, "node_modules", ".bin", "vite"), ["build", "--outDir", dir, "--emptyOutDir", "--logLevel", "error"], { cwd: repoRoot });
  if (built !== 0) throw new Error("client build failed");
}
