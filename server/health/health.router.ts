import { sql } from "drizzle-orm";
import type { Database } from "../db/client";
import type { Mailer } from "../mail/mailer";
import type { Storage } from "../storage/storage";
import { publicAccess, type RouteSpec } from "../http/route-table";

/** How long a service found up is believed up before it is checked again. */
const HEALTH_KEPT_MS = 5_000;

/**
 * A check that never runs twice at once (callers arriving meanwhile share the one running) and, once
 * it finds the service up, is believed for `keptMs`. A service found down is checked again on the
 * next call, so its return shows at once.
 */
function sharedCheck(check: () => Promise<boolean>, keptMs: number): () => Promise<boolean> {
  let running: Promise<boolean> | null = null;
  let upUntil = 0;
  return () => {
    if (Date.now() < upUntil) return Promise.resolve(true);
    running ??= check()
      .then((up) => {
        if (up) upUntil = Date.now() + keptMs;
        return up;
      })
      .finally(() => {
        running = null;
      });
    return running;
  };
}

async function databaseUp(db: Database): Promise<boolean> {
  try {
    await db.execute(sql`select 1`);
    return true;
  } catch {
    return false;
  }
}

/**
 * Anyone may ask whether Kerf is up: the answer's status and the database's state. Signed-in callers
 * also see mail and storage, whose checks open a connection each, so those are shared and kept a few
 * seconds: nobody can make Kerf dial its mail server and object store on every anonymous request.
 */
export function healthRoutes(db: Database, mailer: Mailer, storage: Storage): RouteSpec[] {
  const database = sharedCheck(() => databaseUp(db), 0);
  const mail = sharedCheck(() => mailer.verify(), HEALTH_KEPT_MS);
  const store = sharedCheck(() => storage.up(), HEALTH_KEPT_MS);
  return [
    {
      method: "get",
      path: "/api/health",
      access: publicAccess,
      sessionOptional: true,
      handler: async (req, res) => {
        const databaseState = await database();
        const status = { status: databaseState ? "ok" : "degraded", database: databaseState ? "up" : "down" };
        if (!req.user) return res.status(databaseState ? 200 : 503).json(status);
        const [mailState, storeState] = await Promise.all([mail(), store()]);
        // Mail being down delays mail (it waits in the queue) and storage being down stops uploads and
        // previews (they answer 503), but neither makes Kerf unhealthy.
        res.status(databaseState ? 200 : 503).json({ ...status, mail: mailState ? "up" : "down", storage: storeState ? "up" : "down" });
      },
    },
  ];
}
