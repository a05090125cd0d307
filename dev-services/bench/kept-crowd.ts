import { createHash } from "node:crypto";
import { existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import path from "node:path";
import pg from "pg";
import { migrateDatabase } from "../../server/db/migrate";
import { repoRoot, stateDir } from "../paths";
import { BULK_LOAD_SETTINGS, type Cluster, ensureDatabase, startCluster } from "../postgres";
import { freePort, run } from "../processes";
import { type CrowdFigures, crowdSizeFromEnv, describeCrowd, seedCrowdInto } from "./crowd";

const KEPT = path.join(stateDir, "bench-crowd");
const KEPT_DATABASE = "kerf_bench";

/**
 * A benchmark's own cluster at `dataDir` (bulk-load settings), with one migrated database `name`
 * already holding the crowd (crowd.ts). Seeding 10,000 channels takes a quarter of an hour, so with
 * BENCH_CROWD_KEEP=1 the crowded cluster is kept under .kerf/bench-crowd/ once made and every later
 * run starts from a copy of it, which takes seconds. The kept cluster is named by the crowd's size, the
 * migrations and the seeder it was made with: a new migration, a changed seeder or another size seeds anew.
 */
export async function crowdedCluster(dataDir: string, name: string): Promise<{ cluster: Cluster; databaseUrl: string; crowd: CrowdFigures }> {
  if (process.env.BENCH_CROWD_KEEP !== "1" || crowdSizeFromEnv().channels <= 0) {
    const cluster = startCluster({ dataDir, port: await freePort(), fresh: true, settings: BULK_LOAD_SETTINGS });
    const databaseUrl = await ensureDatabase(cluster, name);
    await migrateDatabase(databaseUrl);
    return { cluster, databaseUrl, crowd: await seedCrowdInto(databaseUrl) };
  }
  const kept = await keptCrowd();
  rmSync(dataDir, { recursive: true, force: true });
  mkdirSync(path.dirname(dataDir), { recursive: true });
  // cp -a keeps the files' owner (the postgres user, when run as root) and modes, as PostgreSQL wants them.
  if ((await run("cp", ["-a", kept.dataDir, dataDir])) !== 0) throw new Error(`could not copy the kept crowd from ${kept.dataDir}`);
  // The copy leaves gigabytes for the kernel to write back; timed commits would wait behind them.
  if ((await run("sync", [])) !== 0) throw new Error("could not flush the copied crowd to disk");
  const cluster = startCluster({ dataDir, port: await freePort(), settings: BULK_LOAD_SETTINGS });
  await renameDatabase(cluster, KEPT_DATABASE, name);
  console.log(`The other channels, from the kept copy: ${describeCrowd(kept.crowd)}`);
  return { cluster, databaseUrl: cluster.url(name), crowd: kept.crowd };
}

/** The kept crowded cluster (stopped) for this size and these migrations, seeded first if there is none. */
async function keptCrowd(): Promise<{ dataDir: string; crowd: CrowdFigures }> {
  const size = crowdSizeFromEnv();
  const made = createHash("sha256");
  for (const file of ["drizzle/meta/_journal.json", "dev-services/bench/crowd.ts"]) made.update(readFileSync(path.join(repoRoot, file)));
  const folder = path.join(KEPT, `${size.channels}x${size.episodesPerChannel}x${size.clipsPerEpisode}-${made.digest("hex").slice(0, 12)}`);
  const dataDir = path.join(folder, "pg");
  const ready = path.join(folder, "crowd.json");
  if (existsSync(ready)) return { dataDir, crowd: JSON.parse(readFileSync(ready, "utf8")) as CrowdFigures };
  // Only one kept crowd at a time: each is gigabytes.
  rmSync(KEPT, { recursive: true, force: true });
  const cluster = startCluster({ dataDir, port: await freePort(), fresh: true, settings: BULK_LOAD_SETTINGS });
  try {
    const databaseUrl = await ensureDatabase(cluster, KEPT_DATABASE);
    await migrateDatabase(databaseUrl);
    const crowd = await seedCrowdInto(databaseUrl);
    cluster.stop();
    writeFileSync(ready, JSON.stringify(crowd));
    return { dataDir, crowd };
  } catch (error) {
    cluster.stop();
    throw error;
  }
}

async function renameDatabase(cluster: Cluster, from: string, to: string): Promise<void> {
  if (from === to) return;
  const admin = new pg.Client({ connectionString: cluster.url("postgres") });
  await admin.connect();
  try {
    await admin.query(`alter database "${from}" rename to "${to}"`);
  } finally {
    await admin.end();
  }
}
