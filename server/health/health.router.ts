import { sql } from "drizzle-orm";
import type { Database } from "../db/client";
import type { Mailer } from "../mail/mailer";
import type { Storage } from "../storage/storage";
import { publicAccess, type RouteSpec } from "../http/route-table";

async function databaseUp(db: Database): Promise<boolean> {
  try {
    await db.execute(sql`select 1`);
    return true;
  } catch {
    return false;
  }
}

export function healthRoutes(db: Database, mailer: Mailer, storage: Storage): RouteSpec[] {
  return [
    {
      method: "get",
      path: "/api/health",
      access: publicAccess,
      sessionless: true,
      handler: async (_req, res) => {
        const [database, mail, store] = await Promise.all([databaseUp(db), mailer.verify(), storage.up()]);
        // Mail being down delays mail (it waits in the queue) but does not make Kerf unhealthy.
        res.status(database ? 200 : 503).json({
          status: database ? "ok" : "degraded",
          database: database ? "up" : "down",
          mail: mail ? "up" : "down",
          // Storage being down stops uploads and previews (they answer 503) but not the rest of Kerf.
          storage: store ? "up" : "down",
        });
      },
    },
  ];
}
