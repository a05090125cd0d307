import { and, eq } from "drizzle-orm";
import type { Database } from "../db/client";
import { stills } from "../db/schema/rushes";

type Executor = Pick<Database, "select" | "insert">;

export async function insertStill(db: Executor, values: typeof stills.$inferInsert) {
  const [row] = await db.insert(stills).values(values).returning();
  return row!;
}

export async function findStill(db: Executor, channelId: string, stillId: string) {
  const rows = await db
    .select()
    .from(stills)
    .where(and(eq(stills.id, stillId), eq(stills.channelId, channelId)))
    .limit(1);
  return rows[0] ?? null;
}
