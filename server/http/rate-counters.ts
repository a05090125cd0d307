import { createHash } from "node:crypto";
import { and, eq, gt, lt, sql } from "drizzle-orm";
import type { ClientRateLimitInfo, Options, Store } from "express-rate-limit";
import type { Database } from "../db/client";
import { rateLimitCounters as counters } from "../db/schema/limits";

/** Every so many increments a process also deletes the counters whose window has passed. */
const PRUNE_EVERY = 500;

/**
 * express-rate-limit's store for counters in PostgreSQL, so a limit holds across every server process
 * (docs/decisions/0012-server-processes-share-only-postgres.md). Windows are fixed and timed by the
 * database's clock: the first hit of a key starts one, and a hit after it ends starts the next.
 * One store per limit: `name` keeps the limits' counters apart.
 */
export class PostgresRateCounters implements Store {
  readonly localKeys = false;
  readonly prefix: string;
  #windowMs = 60_000;
  #increments = 0;

  constructor(
    private readonly db: Database,
    name: string,
  ) {
    this.prefix = `${name}:`;
  }

  init(options: Options): void {
    this.#windowMs = options.windowMs;
  }

  #rowKey(key: string): string {
    return createHash("sha256").update(this.prefix + key).digest("base64url");
  }

  async get(key: string): Promise<ClientRateLimitInfo | undefined> {
    const [row] = await this.db
      .select({ hits: counters.hits, resetsAt: counters.resetsAt })
      .from(counters)
      .where(and(eq(counters.key, this.#rowKey(key)), gt(counters.resetsAt, sql`now()`)));
    return row ? { totalHits: row.hits, resetTime: row.resetsAt } : undefined;
  }

  async increment(key: string): Promise<ClientRateLimitInfo> {
    if (++this.#increments % PRUNE_EVERY === 0) await this.db.delete(counters).where(lt(counters.resetsAt, sql`now()`));
    const windowEnds = sql`now() + ${this.#windowMs} * interval '1 millisecond'`;
    const passed = sql`${counters.resetsAt} <= now()`;
    const [row] = await this.db
      .insert(counters)
      .values({ key: this.#rowKey(key), hits: 1, resetsAt: windowEnds })
      .onConflictDoUpdate({
        target: counters.key,
        set: {
          hits: sql`case when ${passed} then 1 else ${counters.hits} + 1 end`,
          resetsAt: sql`case when ${passed} then excluded.resets_at else ${counters.resetsAt} end`,
        },
      })
      .returning({ hits: counters.hits, resetsAt: counters.resetsAt });
    return { totalHits: row!.hits, resetTime: row!.resetsAt };
  }

  async decrement(key: string): Promise<void> {
    await this.db
      .update(counters)
      .set({ hits: sql`${counters.hits} - 1` })
      .where(and(eq(counters.key, this.#rowKey(key)), gt(counters.hits, 0), gt(counters.resetsAt, sql`now()`)));
  }

  async resetKey(key: string): Promise<void> {
    await this.db.delete(counters).where(eq(counters.key, this.#rowKey(key)));
  }
}
